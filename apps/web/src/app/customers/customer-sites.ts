import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { firstValueFrom } from 'rxjs';
import { errorText } from '../api/api-problems';
import { ConfirmDialog, ConfirmDialogData } from '../pages/team-page/confirm-dialog';
import { CustomersApi, Site } from './customers-api';
import { SiteDialog, SiteDialogData } from './site-dialog';

/** The customer's sites, each with what the crew needs; writers add, edit and remove them. */
@Component({
  selector: 'lw-customer-sites',
  imports: [MatButton, MatIcon],
  templateUrl: './customer-sites.html',
  styleUrl: './customer-sites.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CustomerSites {
  private readonly api = inject(CustomersApi);
  private readonly dialog = inject(MatDialog);

  readonly customerId = input.required<string>();
  readonly sites = input.required<readonly Site[]>();
  readonly canWrite = input(false);
  /** The sites after an add, edit or removal. */
  readonly changed = output<readonly Site[]>();

  protected readonly problem = signal<string | null>(null);

  protected label(site: Site): string {
    return site.name || site.addressLines[0] || 'Site';
  }

  protected async edit(site?: Site): Promise<void> {
    this.problem.set(null);
    const ref = this.dialog.open<SiteDialog, SiteDialogData, Site>(SiteDialog, {
      data: { customerId: this.customerId(), site },
      maxWidth: '95vw',
    });
    const saved = await firstValueFrom(ref.afterClosed());
    if (!saved) return;
    const list = this.sites();
    this.changed.emit(site ? list.map((s) => (s.id === saved.id ? saved : s)) : [...list, saved]);
  }

  protected async remove(site: Site): Promise<void> {
    this.problem.set(null);
    const data: ConfirmDialogData = {
      title: `Remove ${this.label(site)}?`,
      message: 'The site and its details go. A site that jobs use stays on file.',
      confirm: 'Remove',
    };
    const ref = this.dialog.open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, {
      data,
    });
    if (!(await firstValueFrom(ref.afterClosed()))) return;
    try {
      await firstValueFrom(this.api.removeSite(site.id));
      this.changed.emit(this.sites().filter((s) => s.id !== site.id));
    } catch (err: unknown) {
      this.problem.set(errorText(err));
    }
  }
}
