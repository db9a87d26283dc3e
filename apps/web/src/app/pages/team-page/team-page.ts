import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import type { Role } from '@latchwork/shared-access';
import { firstValueFrom } from 'rxjs';
import { errorText } from '../../api/api-problems';
import { Member, MembersApi } from '../../api/members-api';
import { ROLE_OPTIONS } from '../../session/role-label';
import { Session } from '../../session/session.store';
import { ConfirmDialog, ConfirmDialogData } from './confirm-dialog';
import { InviteForm } from './invite-form';

/**
 * The firm's people: their roles (changed in place), who has not joined yet (with a new
 * invitation link on request), removal after a confirmation, and the invitation form.
 */
@Component({
  selector: 'lw-team-page',
  imports: [DatePipe, MatButton, MatIcon, MatSelect, MatOption, InviteForm],
  templateUrl: './team-page.html',
  styleUrl: './team-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TeamPage {
  private readonly api = inject(MembersApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly session = inject(Session);

  protected readonly roles = ROLE_OPTIONS;
  protected readonly members = signal<readonly Member[] | null>(null);
  /** A refusal or failure of the last change, shown above the table until the next change. */
  protected readonly problem = signal<string | null>(null);
  /** Rows with a change in flight, so their controls are disabled meanwhile. */
  protected readonly pending = signal<ReadonlySet<string>>(new Set());
  protected readonly canWrite = computed(() => this.session.can('members:write'));

  constructor() {
    void this.load();
  }

  protected async load(): Promise<void> {
    try {
      this.members.set(await firstValueFrom(this.api.list()));
    } catch (err: unknown) {
      this.problem.set(errorText(err));
    }
  }

  /** Shows the new role at once and puts the old one back if the API refuses (last owner). */
  protected async changeRole(member: Member, role: Role): Promise<void> {
    if (role === member.role) return;
    this.problem.set(null);
    this.replace({ ...member, role });
    await this.run(member, async () => {
      try {
        this.replace(await firstValueFrom(this.api.changeRole(member.userId, role)));
        this.snackBar.open(`${member.name} is now ${this.label(role)}.`, undefined, {
          duration: 4000,
        });
      } catch (err: unknown) {
        this.replace(member);
        throw err;
      }
    });
  }

  protected async resend(member: Member): Promise<void> {
    this.problem.set(null);
    await this.run(member, async () => {
      await firstValueFrom(this.api.resendInvitation(member.userId));
      this.snackBar.open(`A new invitation is on its way to ${member.email}.`, undefined, {
        duration: 4000,
      });
    });
  }

  protected async remove(member: Member): Promise<void> {
    this.problem.set(null);
    const data: ConfirmDialogData = {
      title: `Remove ${member.name}?`,
      message: `${member.name} (${member.email}) will no longer be able to open ${this.session.activeTenant()?.name ?? 'this firm'}. You can invite them again later.`,
      confirm: 'Remove',
    };
    const ref = this.dialog.open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, {
      data,
    });
    if (!(await firstValueFrom(ref.afterClosed()))) return;
    await this.run(member, async () => {
      await firstValueFrom(this.api.remove(member.userId));
      this.members.update((list) => list?.filter((m) => m.userId !== member.userId) ?? null);
      this.snackBar.open(`${member.name} was removed from the firm.`, undefined, {
        duration: 4000,
      });
    });
  }

  protected invited(member: Member): void {
    this.members.update((list) => [...(list ?? []), member]);
  }

  protected label(role: string): string {
    return this.roles.find((r) => r.value === role)?.label ?? role;
  }

  /** Runs one change of a row with its controls disabled, showing any refusal above the table. */
  private async run(member: Member, change: () => Promise<void>): Promise<void> {
    this.pending.update((set) => new Set(set).add(member.userId));
    try {
      await change();
    } catch (err: unknown) {
      this.problem.set(errorText(err));
    } finally {
      this.pending.update((set) => {
        const next = new Set(set);
        next.delete(member.userId);
        return next;
      });
    }
  }

  private replace(member: Member): void {
    this.members.update(
      (list) => list?.map((m) => (m.userId === member.userId ? member : m)) ?? null,
    );
  }
}
