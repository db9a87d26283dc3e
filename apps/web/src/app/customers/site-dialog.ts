import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import {
  AbstractControl,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';
import { showProblems } from '../api/api-problems';
import { CustomersApi, Site, SiteInput } from './customers-api';

/** Which customer the site belongs to, and the site when editing one. */
export interface SiteDialogData {
  readonly customerId: string;
  readonly site?: Site;
}

const LINES = 3;

/**
 * Adds or edits a site: where the floor is and what the crew needs to know to get in. Closes
 * with the saved site; the API's field problems appear under their fields.
 */
@Component({
  selector: 'lw-site-dialog',
  imports: [
    ReactiveFormsModule,
    MatButton,
    MatDialogActions,
    MatDialogClose,
    MatDialogContent,
    MatDialogTitle,
    MatError,
    MatFormField,
    MatInput,
    MatLabel,
  ],
  templateUrl: './site-dialog.html',
  styleUrl: './site-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SiteDialog {
  private readonly api = inject(CustomersApi);
  private readonly ref = inject<MatDialogRef<SiteDialog, Site>>(MatDialogRef);
  protected readonly data = inject<SiteDialogData>(MAT_DIALOG_DATA);
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly lineLabels = ['Address line 1', 'Address line 2', 'Town'];
  protected readonly form = this.fb.group({
    name: [this.data.site?.name ?? '', Validators.maxLength(200)],
    addressLines: this.fb.array(
      Array.from({ length: LINES }, (_, i) => {
        const lines = this.data.site?.addressLines ?? [];
        const value = i < LINES - 1 ? (lines[i] ?? '') : lines.slice(i).join(', ');
        return this.fb.control(value, [
          Validators.maxLength(200),
          ...(i === 0 ? [Validators.required] : []),
        ]);
      }),
    ),
    postcode: [this.data.site?.postcode ?? '', Validators.maxLength(16)],
    accessNotes: [this.data.site?.accessNotes ?? '', Validators.maxLength(2000)],
    parking: [this.data.site?.parking ?? '', Validators.maxLength(500)],
    floorType: [this.data.site?.floorType ?? '', Validators.maxLength(100)],
    openingHours: [this.data.site?.openingHours ?? '', Validators.maxLength(200)],
  });
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected async save(): Promise<void> {
    this.problem.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const input: SiteInput = {
      ...v,
      name: v.name.trim(),
      externalRef: this.data.site?.externalRef ?? null,
      addressLines: v.addressLines.map((l) => l.trim()).filter(Boolean),
      postcode: v.postcode.trim() || null,
    };
    this.saving.set(true);
    try {
      const site = this.data.site;
      this.ref.close(
        await firstValueFrom(
          site
            ? this.api.updateSite(site.id, input)
            : this.api.addSite(this.data.customerId, input),
        ),
      );
    } catch (err: unknown) {
      this.problem.set(showProblems(this.form, err, { addressLines: 'addressLines.0' }));
    } finally {
      this.saving.set(false);
    }
  }

  protected errorOf(control: AbstractControl): string {
    const e = control.errors ?? {};
    if (typeof e['server'] === 'string') return e['server'];
    if (e['required']) return 'A site needs its first address line.';
    if (e['maxlength']) return `At most ${e['maxlength'].requiredLength} characters.`;
    return 'Check this field.';
  }
}
