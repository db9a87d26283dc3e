import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTab, MatTabGroup } from '@angular/material/tabs';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { STAGE_LABELS, type Stage } from '@latchwork/jobs-domain';
import { firstValueFrom } from 'rxjs';
import { errorText } from '../api/api-problems';
import { ConfirmDialog, ConfirmDialogData } from '../pages/team-page/confirm-dialog';
import { Session } from '../session/session.store';
import { CustomerSites } from './customer-sites';
import { CustomerDetail, CustomersApi, Site } from './customers-api';
import { moneyText } from './money-text';

/**
 * One customer: who they are and how to reach them, then tabs for details and contacts,
 * sites, jobs, and the quotes, invoices and balance that later work fills in.
 */
@Component({
  selector: 'lw-customer-page',
  imports: [DatePipe, RouterLink, MatButton, MatIcon, MatTab, MatTabGroup, CustomerSites],
  templateUrl: './customer-page.html',
  styleUrl: './customer-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CustomerPage {
  private readonly api = inject(CustomersApi);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(Session);

  protected readonly id = inject(ActivatedRoute).snapshot.paramMap.get('customerId') ?? '';
  protected readonly customer = signal<CustomerDetail | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly canWrite = computed(() => this.session.can('customers:write'));
  protected readonly mainContact = computed(() => this.customer()?.contacts[0] ?? null);

  constructor() {
    void this.load();
  }

  protected money(minor: number | null): string {
    return moneyText(minor, this.customer()?.currency ?? 'GBP');
  }

  protected stage(id: string): string {
    return STAGE_LABELS[id as Stage] ?? id;
  }

  protected sitesChanged(sites: readonly Site[]): void {
    this.customer.update((c) => c && { ...c, sites });
  }

  protected async remove(): Promise<void> {
    const c = this.customer();
    if (!c) return;
    const data: ConfirmDialogData = {
      title: `Remove ${c.name}?`,
      message: `${c.name}, their contacts and ${c.sites.length} site(s) will be removed. A customer with jobs stays on file.`,
      confirm: 'Remove',
    };
    const ref = this.dialog.open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, {
      data,
    });
    if (!(await firstValueFrom(ref.afterClosed()))) return;
    try {
      await firstValueFrom(this.api.remove(c.id));
      this.snackBar.open(`${c.name} was removed.`, undefined, { duration: 4000 });
      await this.router.navigate(['/customers']);
    } catch (err: unknown) {
      this.problem.set(errorText(err));
    }
  }

  private async load(): Promise<void> {
    try {
      this.customer.set(await firstValueFrom(this.api.get(this.id)));
    } catch (err: unknown) {
      this.problem.set(errorText(err));
    }
  }
}
