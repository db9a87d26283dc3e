import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { errorText } from '../../api/api-problems';
import { Session } from '../../session/session.store';
import { PurchasingApi, type ReorderResult, type Suggestion } from './purchasing-api';

const BLOCKED: Record<NonNullable<Suggestion['blocked']>, string> = {
  'no-supplier': 'No preferred supplier: set one in the catalogue',
  'on-open-order': 'Already on an open order',
  'no-cost': 'No cost known: set one in the catalogue',
};

/**
 * What is at or below its reorder point, how much to order and why (the figures behind each
 * suggestion), and the button that drafts the orders now — the nightly run does the same.
 */
@Component({
  selector: 'lw-reorder-page',
  imports: [RouterLink, MatButton, MatIcon],
  templateUrl: './reorder-page.html',
  styleUrl: '../stock-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReorderPage {
  private readonly api = inject(PurchasingApi);
  private readonly session = inject(Session);
  protected readonly canWrite = computed(() => this.session.can('stock:write'));
  protected readonly result = signal<ReorderResult | null>(null);
  protected readonly created = signal<ReorderResult['created']>([]);
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly blockedText = BLOCKED;

  constructor() {
    this.load();
  }

  private load(): void {
    this.api.suggestions().subscribe({
      next: (r) => this.result.set(r),
      error: (err: unknown) => this.problem.set(errorText(err)),
    });
  }

  protected why(s: Suggestion): string {
    return s.reasons.map((r) => r.message).join(' ');
  }

  protected run(): void {
    this.busy.set(true);
    this.problem.set(null);
    this.api.runReorder().subscribe({
      next: (r) => {
        this.created.set(r.created);
        this.busy.set(false);
        this.load();
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.problem.set(errorText(err));
      },
    });
  }
}
