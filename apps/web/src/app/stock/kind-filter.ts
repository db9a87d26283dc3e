import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatOption, MatSelect } from '@angular/material/select';
import { KIND_LABELS } from './stock-format';

/** The "Kind" filter of the stock lists: every product kind, or all of them. */
@Component({
  selector: 'lw-kind-filter',
  imports: [MatFormField, MatLabel, MatOption, MatSelect],
  template: `
    <mat-form-field subscriptSizing="dynamic">
      <mat-label>Kind</mat-label>
      <mat-select [value]="value()" (selectionChange)="changed.emit($event.value)">
        <mat-option value="">Every kind</mat-option>
        @for (k of kinds; track k[0]) {
          <mat-option [value]="k[0]">{{ k[1] }}</mat-option>
        }
      </mat-select>
    </mat-form-field>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KindFilter {
  readonly value = input('');
  readonly changed = output<string>();
  protected readonly kinds = Object.entries(KIND_LABELS);
}
