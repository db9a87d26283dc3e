/**
 * @-mentions in job notes: finds `@name` against the firm's team so that the people named
 * can be told by e-mail. Names may hold spaces ("@Dee Okafor"); matching ignores case and
 * prefers the longest name ("@Sam Hale" is Sam Hale, not Sam); an e-mail address
 * ("sam@firm.test") is not a mention.
 */

export interface TeamMember {
  readonly id: string;
  readonly name: string;
}

/** One mention in the text: `text.slice(start, end)` is the "@Name" as typed. */
export interface MentionSpan {
  readonly start: number;
  readonly end: number;
  readonly text: string;
  /** Usually one; several when team members share the same name (all are told). */
  readonly memberIds: readonly string[];
}

export interface MentionResult {
  /** Each mentioned member once, in order of first mention. */
  readonly members: readonly TeamMember[];
  readonly spans: readonly MentionSpan[];
}

// RFC 5322 §3.2.3 atext plus ".": a character that can end an address's local part. An "@"
// right after one is an e-mail address, not a mention. "@@" is not one either.
const ADDRESS_CHAR = /[\p{L}\p{N}!#$%&'*+\-/=?^_`{|}~.@]/u;
// After a name: a letter or digit continues a longer word ("@Annabel" is not "@Ann"); ".",
// "-" or "@" followed by one makes it a domain or a longer name ("@ann.test", "@Ann-Marie").
const CONTINUES = /^(?:[\p{L}\p{N}_]|[.\-@][\p{L}\p{N}])/u;

function namePattern(name: string): RegExp {
  const escaped = name.replace(/[.*+?^${}()|[\]\\]/g, '\\$&').replace(/\s+/g, '\\s+');
  // Sticky, so it matches exactly at the position after "@"; "i" + "u": Unicode case folding.
  return new RegExp(escaped, 'iuy');
}

interface Candidate {
  readonly pattern: RegExp;
  readonly length: number;
  readonly members: TeamMember[];
}

function candidates(team: readonly TeamMember[]): Candidate[] {
  const byName = new Map<string, TeamMember[]>();
  for (const m of team) {
    const key = m.name.trim().replace(/\s+/g, ' ').toLowerCase();
    if (!key) continue;
    byName.set(key, [...(byName.get(key) ?? []), m]);
  }
  return [...byName.entries()]
    .map(([key, members]) => ({ pattern: namePattern(key), length: key.length, members }))
    .sort((a, b) => b.length - a.length);
}

/** Finds the mentions in a note. Pure: the caller sends the e-mails. */
export function parseMentions(text: string, team: readonly TeamMember[]): MentionResult {
  const names = candidates(team);
  const spans: MentionSpan[] = [];
  const members = new Map<string, TeamMember>();
  let at = text.indexOf('@');
  while (at !== -1) {
    const before = at > 0 ? text[at - 1] : '';
    let next = at + 1;
    if (!before || !ADDRESS_CHAR.test(before)) {
      for (const c of names) {
        c.pattern.lastIndex = at + 1;
        const m = c.pattern.exec(text);
        if (!m) continue;
        const end = at + 1 + m[0].length;
        if (CONTINUES.test(text.slice(end, end + 2))) continue;
        spans.push({
          start: at,
          end,
          text: text.slice(at, end),
          memberIds: c.members.map((x) => x.id),
        });
        for (const member of c.members) if (!members.has(member.id)) members.set(member.id, member);
        next = end;
        break;
      }
    }
    at = text.indexOf('@', next);
  }
  return { members: [...members.values()], spans };
}
