import { describe, expect, it } from 'vitest';
import { parseMentions, type TeamMember } from './mentions';

const team: TeamMember[] = [
  { id: 'sam', name: 'Sam' },
  { id: 'samh', name: 'Sam Hale' },
  { id: 'dee', name: 'Dee Okafor' },
  { id: 'ann', name: 'Ann' },
  { id: 'zoe', name: 'Zoë Brandt' },
  { id: 'jo1', name: 'Jo Price' },
  { id: 'jo2', name: 'jo  price' },
];

const ids = (text: string) => parseMentions(text, team).members.map((m) => m.id);

// Source for the matching rules: common practice of mention pickers in messaging tools
// (case-insensitive, longest name wins, whole words only); e-mail addresses per RFC 5322.
describe('parseMentions', () => {
  it('finds names with spaces, any case, and reports spans as typed', () => {
    const text = 'Ask @dee okafor and @SAM about the ramp.';
    const r = parseMentions(text, team);
    expect(r.members.map((m) => m.id)).toEqual(['dee', 'sam']);
    expect(r.spans).toEqual([
      { start: 4, end: 15, text: '@dee okafor', memberIds: ['dee'] },
      { start: 20, end: 24, text: '@SAM', memberIds: ['sam'] },
    ]);
    expect(text.slice(r.spans[0].start, r.spans[0].end)).toBe('@dee okafor');
  });

  it('prefers the longest name: "@Sam Hale" is Sam Hale, "@Sam Harris" is Sam', () => {
    expect(ids('@Sam Hale will measure')).toEqual(['samh']);
    expect(ids('@Sam Harris is the customer')).toEqual(['sam']);
  });

  it('e-mail addresses are not mentions (RFC 5322 local part before "@")', () => {
    expect(ids('send it to ann@firm.test please')).toEqual([]);
    expect(ids('cc dee.okafor+jobs@firm.test')).toEqual([]);
    expect(ids('@ann.test is a domain, @Ann-Marie another name')).toEqual([]);
  });

  it('needs the whole name: "@Annabel" is not Ann; punctuation after a name is fine', () => {
    expect(ids('@Annabel called')).toEqual([]);
    expect(ids('thanks @Ann, and (@Dee Okafor).')).toEqual(['ann', 'dee']);
    expect(ids("@Ann's van is in")).toEqual(['ann']);
  });

  it('accented names, line breaks and tabs inside a name', () => {
    expect(ids('@zoë brandt')).toEqual(['zoe']);
    expect(ids('@ZOË BRANDT')).toEqual(['zoe']);
    expect(ids('@Dee\nOkafor')).toEqual(['dee']);
  });

  it('members who share a name are all told; each member once', () => {
    const r = parseMentions('@Jo Price and again @jo price', team);
    expect(r.spans).toHaveLength(2);
    expect(r.spans[0].memberIds).toEqual(['jo1', 'jo2']);
    expect(r.members.map((m) => m.id)).toEqual(['jo1', 'jo2']);
  });

  it('nothing for a lone "@", unknown names or an empty team', () => {
    expect(ids('meet @ 9, @Bob too')).toEqual([]);
    expect(parseMentions('@Sam', []).spans).toEqual([]);
    expect(ids('@@Sam')).toEqual([]);
  });
});
