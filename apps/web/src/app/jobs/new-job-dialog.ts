import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatAutocomplete, MatAutocompleteTrigger } from '@angular/material/autocomplete';
import { MatButton } from '@angular/material/button';
import { MatOption } from '@angular/material/core';
import {
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatSelect } from '@angular/material/select';
import { catchError, debounceTime, distinctUntilChanged, filter, map, of, switchMap } from 'rxjs';
import { showProblems } from '../api/api-problems';
import { parseMoneyInput } from '../customers/money-text';
import { Session } from '../session/session.store';
import { JobsApi, type CustomerOption, type SiteOption } from './jobs-api';

const today = () => new Date().toISOString().slice(0, 10);

/**
 * Opens a job: the customer (searched on the server) and one of their sites, a title, the
 * value as far as it is known, where the enquiry came from, who owns it and the dates known so
 * far. Closes with the new job's id.
 */
@Component({
  selector: 'lw-new-job-dialog',
  imports: [
    ReactiveFormsModule,
    MatAutocomplete,
    MatAutocompleteTrigger,
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
    MatOption,
    MatSelect,
  ],
  templateUrl: './new-job-dialog.html',
  styleUrl: './new-job-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewJobDialog {
  private readonly api = inject(JobsApi);
  private readonly ref = inject(MatDialogRef<NewJobDialog, string>);
  private readonly session = inject(Session);
  private readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');

  protected readonly form = new FormGroup({
    customerText: new FormControl('', { nonNullable: true }),
    customerId: new FormControl('', { nonNullable: true, validators: Validators.required }),
    siteId: new FormControl<string | null>(null),
    title: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(200)],
    }),
    value: new FormControl('', { nonNullable: true }),
    source: new FormControl('', { nonNullable: true, validators: Validators.maxLength(100) }),
    ownerUserId: new FormControl<string | null>(this.session.user()?.id ?? null),
    enquiryOn: new FormControl(today(), { nonNullable: true, validators: Validators.required }),
    surveyAt: new FormControl('', { nonNullable: true }),
    quoteDueOn: new FormControl('', { nonNullable: true }),
    installStartOn: new FormControl('', { nonNullable: true }),
    installEndOn: new FormControl('', { nonNullable: true }),
  });
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly sites = signal<SiteOption[]>([]);
  protected readonly team = toSignal(this.api.team().pipe(catchError(() => of([]))), {
    initialValue: [],
  });
  protected readonly customers = toSignal(
    this.form.controls.customerText.valueChanges.pipe(
      debounceTime(250),
      map((t) => t.trim()),
      distinctUntilChanged(),
      filter((t) => t.length >= 2),
      switchMap((t) =>
        this.api.customers(t).pipe(
          map((r) => r.items),
          catchError(() => of([] as CustomerOption[])),
        ),
      ),
    ),
    { initialValue: [] as CustomerOption[] },
  );
  protected readonly sources = ['Website', 'Phone', 'Referral', 'Returning customer', 'Trade show'];

  protected customerChosen(customer: CustomerOption): void {
    this.form.patchValue({ customerId: customer.id, siteId: null });
    this.sites.set([]);
    this.api.sites(customer.id).subscribe({
      next: (sites) => {
        this.sites.set(sites);
        // One site is the usual case for a homeowner: choose it.
        if (sites.length === 1) this.form.controls.siteId.setValue(sites[0]?.id ?? null);
      },
      error: () => this.sites.set([]),
    });
  }

  protected save(): void {
    this.form.markAllAsTouched();
    const v = this.form.getRawValue();
    const valueMinor = parseMoneyInput(v.value, this.currency());
    if (Number.isNaN(valueMinor)) this.form.controls.value.setErrors({ money: true });
    if (this.form.invalid || this.saving()) return;
    this.saving.set(true);
    this.problem.set(null);
    this.api
      .create({
        title: v.title.trim(),
        customerId: v.customerId,
        siteId: v.siteId,
        valueEstimateMinor: valueMinor,
        source: v.source.trim(),
        ownerUserId: v.ownerUserId,
        enquiryOn: v.enquiryOn,
        // The browser's local time for the survey, sent with its offset.
        surveyAt: v.surveyAt ? new Date(v.surveyAt).toISOString() : null,
        quoteDueOn: v.quoteDueOn || null,
        installStartOn: v.installStartOn || null,
        installEndOn: v.installEndOn || null,
      })
      .subscribe({
        next: (job) => this.ref.close(job.id),
        error: (err: unknown) => {
          this.saving.set(false);
          this.problem.set(
            showProblems(this.form, err, {
              valueEstimateMinor: 'value',
              customerId: 'customerText',
            }),
          );
        },
      });
  }
}
