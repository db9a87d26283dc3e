import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatMenu, MatMenuItem, MatMenuTrigger } from '@angular/material/menu';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router } from '@angular/router';
import { Session } from '../session/session.store';
import { roleLabel } from '../session/role-label';

/**
 * The signed-in person's corner of the top bar: the firm in use (a menu of their firms when
 * they have more than one), their name and role, and Sign out.
 */
@Component({
  selector: 'lw-account-bar',
  imports: [MatButton, MatIconButton, MatIcon, MatMenu, MatMenuItem, MatMenuTrigger],
  templateUrl: './account-bar.html',
  styleUrl: './account-bar.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AccountBar {
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly session = inject(Session);

  /** On phones the name is left out and Sign out is an icon, so the bar still fits. */
  readonly compact = input(false);

  protected readonly busy = signal(false);
  protected readonly tenant = this.session.activeTenant;
  protected readonly role = computed(() => roleLabel(this.tenant()?.role ?? ''));
  protected readonly several = computed(() => this.session.memberships().length > 1);
  protected readonly roleLabel = roleLabel;

  /** Switches firm and starts again from Home: the page in view belonged to the other firm. */
  protected async switchTo(tenantId: string): Promise<void> {
    if (tenantId === this.tenant()?.id || this.busy()) return;
    this.busy.set(true);
    try {
      await this.session.switchTenant(tenantId);
      await this.router.navigateByUrl('/', { onSameUrlNavigation: 'reload' });
      this.snackBar.open(`Now working in ${this.tenant()?.name ?? 'the other firm'}.`, undefined, {
        duration: 4000,
      });
    } catch {
      // The error interceptor has already said what went wrong; the firm stays as it was.
    } finally {
      this.busy.set(false);
    }
  }

  protected async signOut(): Promise<void> {
    this.busy.set(true);
    try {
      await this.session.signOut();
    } catch {
      this.busy.set(false);
    }
  }
}
