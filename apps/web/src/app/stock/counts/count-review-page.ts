import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { errorText } from '../../api/api-problems';
import { Session } from '../../session/session.store';
import { moneyText } from '../stock-format';
import { COUNT_REASONS, CountsApi, type Count } from './counts-api';

type ReasonRow = FormGroup<{ reason: FormControl<string>; note: FormControl<string> }>;

/**
 * Review of a submitted count: expected (at the start, and when each line was counted) against
 * counted, the difference in packs and money, a reason per differing line; then the owner's
 * approval when the differences are over the firm's limit, and posting.
 */
@Component({
  selector: 'lw-count-review-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatSelect,
  ],
  templateUrl: './count-review-page.html',
  styleUrl: '../stock-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CountReviewPage {
  private readonly api = inject(CountsApi);
  private readonly session = inject(Session);
  private readonly id = inject(ActivatedRoute).snapshot.paramMap.get('countId') ?? '';
  protected readonly reasons = COUNT_REASONS;
  protected readonly canWrite = computed(() => this.session.can('stock:write'));
  protected readonly canApprove = computed(() => this.session.can('stock:approve'));
  protected readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');
  protected readonly count = signal<Count | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly rows = new FormArray<ReasonRow>([]);
  protected readonly open = computed(() => this.count()?.status === 'submitted');

  constructor() {
    this.api.get(this.id).subscribe({
      next: (c) => this.show(c),
      error: (err: unknown) => this.problem.set(errorText(err)),
    });
  }

  private show(c: Count): void {
    this.count.set(c);
    this.rows.clear();
    for (const l of c.lines)
      this.rows.push(
        new FormGroup({
          reason: new FormControl(l.reason ?? '', { nonNullable: true }),
          note: new FormControl(l.reasonNote ?? '', { nonNullable: true }),
        }),
      );
  }

  /** A saved reason in the words the select offered ("Lost or missing"), not its code. */
  protected reasonText(id: string | null | undefined): string {
    return this.reasons.find((r) => r.id === id)?.label ?? id ?? '';
  }

  protected money(minor: number | null | undefined): string {
    return moneyText(minor ?? null, this.currency());
  }

  private act(work: () => ReturnType<CountsApi['get']>): void {
    this.problem.set(null);
    work().subscribe({
      next: (c) => this.show(c),
      error: (err: unknown) => this.problem.set(errorText(err)),
    });
  }

  /** Saves the reasons given, then (when asked) posts. */
  protected saveReasons(then?: 'post'): void {
    const lines = (this.count()?.lines ?? []).flatMap((l, i) => {
      const v = this.rows.at(i).getRawValue();
      return v.reason ? [{ lineId: l.id, reason: v.reason, note: v.note }] : [];
    });
    const post = () => this.act(() => this.api.step(this.id, 'post'));
    if (lines.length === 0) {
      if (then) post();
      return;
    }
    this.problem.set(null);
    this.api.reasons(this.id, lines).subscribe({
      next: (c) => {
        this.show(c);
        if (then) post();
      },
      error: (err: unknown) => this.problem.set(errorText(err)),
    });
  }

  protected approve(): void {
    this.act(() => this.api.step(this.id, 'approve'));
  }

  protected cancel(): void {
    this.act(() => this.api.step(this.id, 'cancel'));
  }
}
