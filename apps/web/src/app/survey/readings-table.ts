import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { KIND_LABELS, METHOD_LABELS, type ReadingMethod } from '@latchwork/jobs-domain';
import { valueText } from './model/reading-units';
import type { SavedReading } from './survey-api';
import { StatusChip } from './status-chip';

/** The job's slab readings with their verdict, the message and the limit's source. */
@Component({
  selector: 'lw-readings-table',
  imports: [DatePipe, MatIcon, MatIconButton, StatusChip],
  templateUrl: './readings-table.html',
  styleUrl: './readings-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReadingsTable {
  readonly readings = input.required<readonly SavedReading[]>();
  /** Whether the person may remove a reading (jobs:write). */
  readonly canEdit = input(false);
  readonly remove = output<SavedReading>();

  protected readonly kindLabel = (r: SavedReading) => KIND_LABELS[r.kind];
  protected readonly methodLabel = (r: SavedReading) =>
    METHOD_LABELS[r.method as ReadingMethod] ?? r.method;
  protected readonly valueOf = (r: SavedReading) => valueText(r.kind, r.value, r.unit);
}
