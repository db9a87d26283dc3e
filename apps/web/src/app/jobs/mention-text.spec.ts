import { insertMention, mentionAt, mentionCandidates } from './mention-text';

const TEAM = [
  { id: '1', name: 'Dev Ramaswamy' },
  { id: '2', name: 'Rosalind Achterberg' },
  { id: '3', name: 'Tomasz Quill' },
];

describe('@-mentions typed in a note', () => {
  it('finds the mention being typed before the caret', () => {
    expect(mentionAt('Ask @Dev', 8)).toEqual({ start: 4, query: 'Dev' });
    expect(mentionAt('@', 1)).toEqual({ start: 0, query: '' });
    expect(mentionAt('Ask @Dev Ra', 11)).toEqual({ start: 4, query: 'Dev Ra' });
  });

  it('does not take an e-mail address for a mention', () => {
    expect(mentionAt('mail dev@kestrel', 16)).toBeNull();
    expect(mentionAt('no mention here', 15)).toBeNull();
  });

  it('offers members whose first or later name starts with what was typed', () => {
    expect(mentionCandidates(TEAM, 'ro').map((m) => m.id)).toEqual(['2']);
    expect(mentionCandidates(TEAM, 'qu').map((m) => m.id)).toEqual(['3']);
    expect(mentionCandidates(TEAM, '')).toHaveLength(3);
  });

  it('puts "@Name " in place of what was typed and the caret after it', () => {
    const text = 'Ask @de about the ramp';
    const mention = mentionAt(text, 7);
    if (!mention) throw new Error('no mention');
    expect(insertMention(text, mention, 7, 'Dev Ramaswamy')).toEqual({
      text: 'Ask @Dev Ramaswamy about the ramp',
      caret: 19,
    });
  });
});
