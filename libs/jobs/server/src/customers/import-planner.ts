import { fingerprint, planImport, type RowError } from '@latchwork/jobs-domain';

export type RowAction = 'create' | 'update' | 'unchanged' | 'error';

/** One row of the preview: what will happen to it, and a label to recognise it by. */
export interface PreviewRow {
  row: number;
  action: RowAction;
  label: string;
}

/** A record on file as the import compares it: its id, match keys and current values. */
export interface OnFile<V> {
  id: string;
  keys: readonly string[];
  values: V;
}

/** A valid row of the file with the keys that match it to a record on file. */
export interface FileRow<R> {
  row: number;
  record: R;
  keys: readonly string[];
}

/** What one kind of import (customers, sites) tells the planner. */
export interface ImportKind<R, V> {
  /** The values the row leaves on file: `base` (null for a new record) changed by the row. */
  merge(base: V | null, record: R): V;
  /** Values as compared: ids and other things the file cannot say left out. */
  comparable(values: V): Record<string, unknown>;
  label(record: R): string;
  /** A further check of a row against the record it matched (e.g. a site of another customer). */
  refuse?(record: R, match: OnFile<V>): string | null;
}

export interface Change<V> {
  row: number;
  id: string | null;
  values: V;
  before: V | null;
}

export interface ImportPlanned<V> {
  rows: PreviewRow[];
  errors: RowError[];
  counts: { create: number; update: number; unchanged: number; error: number };
  /** What to write: creates (`id` null) and updates; unchanged rows are not here. */
  changes: Change<V>[];
}

/**
 * Plans an import with the jobs-domain rules. A row's fingerprint is that of the values it
 * would leave on file, so a row whose cells change nothing (empty cells keep what is on
 * file) compares equal to the record and is `unchanged`: a re-import writes nothing.
 */
export function planRows<R, V>(
  kind: ImportKind<R, V>,
  fileRows: readonly FileRow<R>[],
  onFile: readonly OnFile<V>[],
  earlierErrors: readonly RowError[],
): ImportPlanned<V> {
  const byKey = new Map<string, OnFile<V>>();
  for (const e of onFile) for (const k of e.keys) byKey.set(k, e);
  const errors = [...earlierErrors];
  const print = (v: V) => fingerprint(kind.comparable(v));
  const merged = new Map<number, { values: V; match: OnFile<V> | null }>();
  const planned = fileRows.flatMap((r) => {
    const matches = [...new Set(r.keys.flatMap((k) => byKey.get(k) ?? []))];
    // Two matches: planImport reports the row; the values merged here are not used.
    const match = matches.length === 1 ? matches[0] : null;
    const refusal = match && kind.refuse?.(r.record, match);
    if (refusal) {
      errors.push({ row: r.row, column: '', message: refusal });
      return [];
    }
    const values = kind.merge(match?.values ?? null, r.record);
    merged.set(r.row, { values, match });
    return [{ row: r.row, keys: r.keys, fingerprint: print(values) }];
  });
  const plan = planImport(
    planned,
    onFile.map((e) => ({ id: e.id, keys: e.keys, fingerprint: print(e.values) })),
  );
  errors.push(...plan.errors);
  const labels = new Map(fileRows.map((r) => [r.row, kind.label(r.record)]));
  const rows: PreviewRow[] = plan.actions.map((a) => ({
    row: a.row,
    action: a.action,
    label: labels.get(a.row) ?? '',
  }));
  const errorRows = [...new Set(errors.map((e) => e.row))];
  for (const row of errorRows) rows.push({ row, action: 'error', label: labels.get(row) ?? '' });
  const changes = plan.actions.flatMap((a): Change<V>[] => {
    const m = merged.get(a.row);
    if (!m || a.action === 'unchanged') return [];
    return [
      {
        row: a.row,
        id: a.action === 'update' ? a.id : null,
        values: m.values,
        before: m.match?.values ?? null,
      },
    ];
  });
  return {
    rows: rows.sort((a, b) => a.row - b.row),
    errors: errors.sort((a, b) => a.row - b.row),
    counts: { ...plan.counts, error: errorRows.length },
    changes,
  };
}
