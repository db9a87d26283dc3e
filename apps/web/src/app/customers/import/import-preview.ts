import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import type { ImportPreview as Preview, RowAction } from '../customers-api';

/** Rows of the plan shown at most; the counts cover the whole file. */
export const SHOWN_ROWS = 200;

const ACTION_LABELS: Readonly<Record<RowAction, string>> = {
  create: 'New',
  update: 'Update',
  unchanged: 'No change',
  error: 'Error',
};

/**
 * What an import would do: counts of new, updated and unchanged rows, every error by row,
 * column and reason, and the plan row by row. Shows; changes nothing.
 */
@Component({
  selector: 'lw-import-preview',
  imports: [MatIcon],
  templateUrl: './import-preview.html',
  styleUrl: './import-preview.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ImportPreview {
  readonly preview = input.required<Preview>();

  protected readonly actionLabels = ACTION_LABELS;
  protected readonly shown = computed(() => this.preview().rows.slice(0, SHOWN_ROWS));
  protected readonly hidden = computed(() => Math.max(0, this.preview().rows.length - SHOWN_ROWS));
  /** Errors by row, for the plan table's "why" cell. */
  protected readonly errorsByRow = computed(() => {
    const byRow = new Map<number, string[]>();
    for (const e of this.preview().errors)
      byRow.set(e.row, [
        ...(byRow.get(e.row) ?? []),
        e.column ? `${e.column}: ${e.message}` : e.message,
      ]);
    return byRow;
  });
}
