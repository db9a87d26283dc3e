import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';

export interface ReasonDialogData {
  /** E.g. "Move J-00042 to Lost". */
  readonly title: string;
  /** The domain's sentence asking why. */
  readonly prompt: string;
}

/** Asks why before a move that needs a reason; closes with the reason, or nothing on Cancel. */
@Component({
  selector: 'lw-reason-dialog',
  imports: [
    ReactiveFormsModule,
    MatButton,
    MatDialogActions,
    MatDialogClose,
    MatDialogContent,
    MatDialogTitle,
    MatError,
    MatFormField,
    MatHint,
    MatInput,
    MatLabel,
  ],
  template: `
    <form (submit)="$event.preventDefault(); save()">
      <h2 mat-dialog-title>{{ data.title }}</h2>
      <mat-dialog-content>
        <p>{{ data.prompt }}</p>
        <mat-form-field class="reason">
          <mat-label>Reason</mat-label>
          <textarea
            matInput
            [formControl]="reason"
            rows="3"
            maxlength="500"
            cdkFocusInitial
          ></textarea>
          <mat-hint>Shown in the job's stage history.</mat-hint>
          @if (reason.invalid) {
            <mat-error>Give a reason to make this move.</mat-error>
          }
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit">Move</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .reason {
      width: min(420px, 100%);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReasonDialog {
  protected readonly data = inject<ReasonDialogData>(MAT_DIALOG_DATA);
  private readonly ref = inject(MatDialogRef<ReasonDialog, string>);
  protected readonly reason = new FormControl('', {
    nonNullable: true,
    validators: [Validators.required, Validators.pattern(/\S/)],
  });

  protected save(): void {
    this.reason.markAsTouched();
    if (this.reason.invalid) return;
    this.ref.close(this.reason.value.trim());
  }
}
