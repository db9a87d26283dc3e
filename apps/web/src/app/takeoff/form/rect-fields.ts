import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { LengthInput } from '../length-input';
import type { RectDraft } from '../model/floor-draft';
import type { Units } from '../model/lengths';

/** Position (lower-left corner) and size of a rectangle: a column, a zone, a bay. */
@Component({
  selector: 'lw-rect-fields',
  imports: [LengthInput, MatFormField, MatInput, MatLabel],
  template: `
    <div class="row">
      @for (f of fields; track f.key) {
        <mat-form-field>
          <mat-label>{{ f.label }}</mat-label>
          <input
            matInput
            [lwLength]="rect()[f.key]"
            [units]="units()"
            [min]="f.min"
            (lengthChange)="set(f.key, $event)"
          />
        </mat-form-field>
      }
    </div>
  `,
  styles: `
    .row {
      display: flex;
      flex-wrap: wrap;
      gap: 0 8px;
    }
    mat-form-field {
      flex: 1 1 90px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RectFields {
  readonly rect = input.required<RectDraft>();
  readonly units = input.required<Units>();
  readonly rectChange = output<RectDraft>();

  protected readonly fields = [
    { key: 'x', label: 'From x', min: -Infinity },
    { key: 'y', label: 'From y', min: -Infinity },
    { key: 'w', label: 'Width', min: 1 },
    { key: 'l', label: 'Length', min: 1 },
  ] as const;

  protected set(key: keyof RectDraft, mm: number): void {
    this.rectChange.emit({ ...this.rect(), [key]: mm });
  }
}
