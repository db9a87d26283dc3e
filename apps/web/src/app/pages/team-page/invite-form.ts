import { ChangeDetectionStrategy, Component, inject, output, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import type { Role } from '@latchwork/shared-access';
import { firstValueFrom } from 'rxjs';
import { showProblems } from '../../api/api-problems';
import { Member, MembersApi } from '../../api/members-api';
import { ROLE_OPTIONS } from '../../session/role-label';

/**
 * Invites a person by e-mail with a role. The API's field problems appear under the fields
 * they name; a refusal of the whole invitation (already a member) appears above the button.
 */
@Component({
  selector: 'lw-invite-form',
  imports: [
    ReactiveFormsModule,
    MatButton,
    MatError,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatSelect,
  ],
  templateUrl: './invite-form.html',
  styleUrl: './invite-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InviteForm {
  private readonly api = inject(MembersApi);
  private readonly snackBar = inject(MatSnackBar);

  readonly invited = output<Member>();

  protected readonly roles = ROLE_OPTIONS;
  protected readonly sending = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email, Validators.maxLength(320)]],
    name: ['', [Validators.required, Validators.maxLength(200)]],
    role: ['installer' as Role, Validators.required],
  });

  protected async send(): Promise<void> {
    this.problem.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.sending.set(true);
    try {
      const member = await firstValueFrom(this.api.invite(this.form.getRawValue()));
      this.invited.emit(member);
      this.snackBar.open(`Invitation sent to ${member.email}.`, undefined, { duration: 4000 });
      this.form.reset();
    } catch (err: unknown) {
      this.problem.set(showProblems(this.form, err));
    } finally {
      this.sending.set(false);
    }
  }

  /** The first thing wrong with a field, in words. */
  protected errorOf(name: 'email' | 'name'): string {
    const errors = this.form.controls[name].errors ?? {};
    if (typeof errors['server'] === 'string') return errors['server'];
    if (errors['required']) return name === 'email' ? 'Enter an e-mail address.' : 'Enter a name.';
    if (errors['email']) return 'Enter an e-mail address such as name@example.test.';
    return 'Too long.';
  }
}
