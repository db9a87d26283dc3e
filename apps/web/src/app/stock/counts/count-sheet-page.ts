import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { errorText } from '../../api/api-problems';
import { CountsApi, type Count, type CountLine } from './counts-api';

const WHOLE = Validators.pattern(/^\d{0,9}$/);

type Row = FormGroup<{ packs: FormControl<string>; units: FormControl<string> }>;

/**
 * The blind count sheet, made for a phone held in one hand: one product (and batch) per row,
 * big inputs for whole packs and loose units ("3 boxes + 5 tiles"), no book figures anywhere.
 * Entries are saved as often as the counter likes; submitting hands the count to review.
 */
@Component({
  selector: 'lw-count-sheet-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatError,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
  ],
  templateUrl: './count-sheet-page.html',
  styleUrls: ['../stock-page.scss', './count-sheet-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CountSheetPage {
  private readonly api = inject(CountsApi);
  private readonly router = inject(Router);
  private readonly countId = inject(ActivatedRoute).snapshot.paramMap.get('countId') ?? '';
  protected readonly count = signal<Count | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly saved = signal<string | null>(null);
  protected readonly rows = new FormArray<Row>([]);

  constructor() {
    this.api.get(this.countId).subscribe({
      next: (c) => this.show(c),
      error: (err: unknown) => this.problem.set(errorText(err)),
    });
  }

  private show(c: Count): void {
    if (c.status !== 'counting') {
      void this.router.navigate(['/stock/counts', c.id]);
      return;
    }
    this.count.set(c);
    this.rows.clear();
    for (const l of c.lines) {
      const packs =
        l.counted === null || l.packSize <= 1 ? null : Math.floor(l.counted / l.packSize);
      const units =
        l.counted === null ? null : l.packSize <= 1 ? l.counted : l.counted % l.packSize;
      this.rows.push(
        new FormGroup({
          packs: new FormControl(packs === null ? '' : String(packs), {
            nonNullable: true,
            validators: WHOLE,
          }),
          units: new FormControl(units === null ? '' : String(units), {
            nonNullable: true,
            validators: WHOLE,
          }),
        }),
      );
    }
  }

  protected plural(l: CountLine, n: 'pack' | 'unit'): string {
    return n === 'pack' ? l.units.packOther : l.units.unitOther;
  }

  /** The rows the counter has filled in (either box), as the API takes them. */
  private entries(): { lineId: string; packs: number; units: number }[] {
    const lines = this.count()?.lines ?? [];
    return this.rows.controls.flatMap((row, i) => {
      const v = row.getRawValue();
      if (v.packs === '' && v.units === '') return [];
      return [{ lineId: lines[i].id, packs: Number(v.packs || 0), units: Number(v.units || 0) }];
    });
  }

  protected save(then?: () => void): void {
    if (this.rows.invalid) return this.rows.markAllAsTouched();
    const entries = this.entries();
    if (entries.length === 0) return then?.();
    this.problem.set(null);
    this.api.enter(this.countId, entries).subscribe({
      next: (c) => {
        this.saved.set(`Saved ${entries.length} line${entries.length === 1 ? '' : 's'}.`);
        this.count.set(c);
        then?.();
      },
      error: (err: unknown) => this.problem.set(errorText(err)),
    });
  }

  protected submit(): void {
    this.save(() =>
      this.api.step(this.countId, 'submit').subscribe({
        next: (c) => void this.router.navigate(['/stock/counts', c.id]),
        error: (err: unknown) => this.problem.set(errorText(err)),
      }),
    );
  }
}
