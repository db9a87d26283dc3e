/**
 * What an import will do with each valid row: create, update or leave unchanged, matched
 * against what is on file by keys (see `customerKeys`, `siteKeys`). Nothing is written here;
 * the preview shows the plan and the server carries it out once the user confirms.
 */
import type { RowError } from './import-fields';

/** A valid row to plan: its keys and a fingerprint of its content (`fingerprint`). */
export interface PlannedRow {
  readonly row: number;
  readonly keys: readonly string[];
  readonly fingerprint: string;
}

/** A record on file, keyed and fingerprinted the same way. */
export interface ExistingKeys {
  readonly id: string;
  readonly keys: readonly string[];
  readonly fingerprint: string;
}

export type ImportAction =
  | { readonly row: number; readonly action: 'create' }
  | { readonly row: number; readonly action: 'update' | 'unchanged'; readonly id: string };

export interface ImportPlan {
  readonly actions: ImportAction[];
  /** Rows that repeat an earlier row of the file or match two records on file. */
  readonly errors: RowError[];
  readonly counts: { readonly create: number; readonly update: number; readonly unchanged: number };
}

/**
 * A stable text of a record's content: keys sorted, values as JSON. Two records with the
 * same fields and values give the same fingerprint whatever order the fields came in.
 */
export function fingerprint(record: Readonly<Record<string, unknown>>): string {
  const keys = Object.keys(record).sort();
  return JSON.stringify(keys.map((k) => [k, record[k] ?? null]));
}

const keyLabel = (key: string) =>
  key.startsWith('email:') ? 'e-mail' : key.startsWith('ref:') ? 'reference' : 'address';

/**
 * Plans the import. A row matches the record on file that shares any of its keys; it is
 * `unchanged` when the fingerprints agree, else `update`; without a match, `create`. A row
 * whose keys point at two different records, or that repeats a key of an earlier row in the
 * file, is an error (importing it would merge or duplicate customers).
 */
export function planImport(
  rows: readonly PlannedRow[],
  existing: readonly ExistingKeys[],
): ImportPlan {
  const onFile = new Map<string, ExistingKeys>();
  for (const e of existing) for (const k of e.keys) onFile.set(k, e);
  const seenInFile = new Map<string, number>();
  const actions: ImportAction[] = [];
  const errors: RowError[] = [];
  const counts = { create: 0, update: 0, unchanged: 0 };
  for (const r of rows) {
    const earlier = r.keys.find((k) => seenInFile.has(k));
    if (earlier) {
      errors.push({
        row: r.row,
        column: keyLabel(earlier),
        message: `Same ${keyLabel(earlier)} as row ${seenInFile.get(earlier)}.`,
      });
      continue;
    }
    for (const k of r.keys) seenInFile.set(k, r.row);
    const matches = [...new Set(r.keys.flatMap((k) => onFile.get(k) ?? []))];
    if (matches.length > 1) {
      errors.push({
        row: r.row,
        column: keyLabel(r.keys[0]),
        message: `Its ${[...new Set(r.keys.map(keyLabel))].join(' and ')} match different records on file.`,
      });
      continue;
    }
    const match = matches[0];
    const action: ImportAction = !match
      ? { row: r.row, action: 'create' }
      : {
          row: r.row,
          action: match.fingerprint === r.fingerprint ? 'unchanged' : 'update',
          id: match.id,
        };
    counts[action.action] += 1;
    actions.push(action);
  }
  return { actions, errors, counts };
}
