import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { roleLabel } from '../../session/role-label';
import { Session } from '../../session/session.store';

/**
 * Shown in place of a page the signed-in person's role does not include. It names the role
 * and who can change it, rather than a bare "403".
 */
@Component({
  selector: 'lw-forbidden-page',
  imports: [MatButton, MatIcon, RouterLink],
  templateUrl: './forbidden-page.html',
  styleUrl: '../not-found-page/not-found-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ForbiddenPage {
  private readonly session = inject(Session);
  private readonly query = toSignal(inject(ActivatedRoute).queryParamMap, { requireSync: true });

  /** The address the person asked for. */
  protected readonly address = computed(() => this.query().get('page') ?? '');
  protected readonly role = computed(() => roleLabel(this.session.activeTenant()?.role ?? ''));
  protected readonly firm = computed(() => this.session.activeTenant()?.name ?? 'this firm');
}
