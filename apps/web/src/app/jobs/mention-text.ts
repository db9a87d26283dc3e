/** The @-mention being typed just before the caret: where its "@" is and what follows it. */
export interface MentionQuery {
  readonly start: number;
  readonly query: string;
}

// "@" at the start or after a space or opening bracket (not in an e-mail address), then up to
// three words of a name, ending at the caret.
const TYPING = /(?:^|[\s([])@([\p{L}\p{M}'’-]*(?: [\p{L}\p{M}'’-]*){0,2})$/u;

/** The mention typed up to `caret`, or null when the caret is not in one. */
export function mentionAt(text: string, caret: number): MentionQuery | null {
  const m = TYPING.exec(text.slice(0, caret));
  if (!m) return null;
  const query = m[1] ?? '';
  return { start: caret - query.length - 1, query };
}

/** Team members whose name starts with the typed words (any case), at most `limit`. */
export function mentionCandidates<T extends { name: string }>(
  team: readonly T[],
  query: string,
  limit = 6,
): T[] {
  const q = query.trim().toLowerCase();
  return team
    .filter((m) => m.name.toLowerCase().startsWith(q) || m.name.toLowerCase().includes(` ${q}`))
    .slice(0, limit);
}

/** The text with the mention being typed replaced by "@Name ", and where the caret goes. */
export function insertMention(
  text: string,
  mention: MentionQuery,
  caret: number,
  name: string,
): { text: string; caret: number } {
  const inserted = `@${name} `;
  return {
    text: text.slice(0, mention.start) + inserted + text.slice(caret).replace(/^ /, ''),
    caret: mention.start + inserted.length,
  };
}
