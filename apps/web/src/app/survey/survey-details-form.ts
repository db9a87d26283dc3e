import { HttpClient } from '@angular/common/http';
import {
  ChangeDetectionStrategy,
  Component,
  effect,
  inject,
  input,
  output,
  signal,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { catchError, of } from 'rxjs';
import { showProblems } from '../api/api-problems';
import { localNow } from './model/reading-units';
import { SUBSTRATE_LABELS, type Substrate, type SurveyDetails, SurveyApi } from './survey-api';

interface TeamMember {
  readonly id: string;
  readonly name: string;
}

/** A `datetime-local` value for an ISO instant, in the browser's time zone. */
const toLocal = (iso: string | null) => (iso ? localNow(new Date(iso)) : '');

/** Substrate, when and by whom the survey was done, and notes; saved together. */
@Component({
  selector: 'lw-survey-details-form',
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
  templateUrl: './survey-details-form.html',
  styleUrl: './survey-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SurveyDetailsForm {
  private readonly api = inject(SurveyApi);

  readonly jobId = input.required<string>();
  readonly details = input<SurveyDetails | null>(null);
  readonly canEdit = input(false);
  readonly saved = output<void>();

  protected readonly substrates = Object.entries(SUBSTRATE_LABELS) as [Substrate, string][];
  protected readonly team = toSignal(
    inject(HttpClient)
      .get<TeamMember[]>('/api/v1/jobs/team')
      .pipe(catchError(() => of([] as TeamMember[]))),
    { initialValue: [] as TeamMember[] },
  );
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly done = signal(false);

  protected readonly form = inject(NonNullableFormBuilder).group({
    substrate: [null as Substrate | null],
    surveyedAt: [''],
    surveyorUserId: [null as string | null],
    notes: ['', Validators.maxLength(10_000)],
  });

  constructor() {
    effect(() => {
      const d = this.details();
      this.form.reset({
        substrate: d?.substrate ?? null,
        surveyedAt: toLocal(d?.surveyedAt ?? null),
        surveyorUserId: d?.surveyorUserId ?? null,
        notes: d?.notes ?? '',
      });
      if (this.canEdit()) this.form.enable();
      else this.form.disable();
    });
  }

  protected async save(): Promise<void> {
    this.problem.set(null);
    this.done.set(false);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    this.saving.set(true);
    try {
      await this.api.saveDetails(this.jobId(), {
        substrate: v.substrate,
        surveyedAt: v.surveyedAt ? new Date(v.surveyedAt).toISOString() : null,
        surveyorUserId: v.surveyorUserId,
        notes: v.notes,
      });
      this.done.set(true);
      this.saved.emit();
    } catch (err: unknown) {
      this.problem.set(showProblems(this.form, err));
    } finally {
      this.saving.set(false);
    }
  }
}
