import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import {
  FormGroupDirective,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import {
  evaluateReading,
  readingProblems,
  type EmissionUnit,
  type ReadingEvaluation,
  type ReadingKind,
  type SlabLimits,
} from '@latchwork/jobs-domain';
import { showProblems } from '../api/api-problems';
import {
  EMISSION_UNIT_LABELS,
  KIND_OPTIONS,
  localNow,
  methodOptions,
  otherUnitText,
  unitLabel,
} from './model/reading-units';
import { type SavedReading, SurveyApi } from './survey-api';
import { StatusChip } from './status-chip';

/**
 * Records one slab reading. The method list follows the kind; emission may be typed in either
 * unit and is shown in the other; the verdict against the firm's limits is previewed with the
 * same rule the API applies, and the API's own verdict is what gets stored.
 */
@Component({
  selector: 'lw-reading-form',
  imports: [
    ReactiveFormsModule,
    MatButton,
    MatButtonToggle,
    MatButtonToggleGroup,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatSelect,
    MatSuffix,
    StatusChip,
  ],
  templateUrl: './reading-form.html',
  styleUrl: './reading-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReadingForm {
  private readonly api = inject(SurveyApi);

  readonly jobId = input.required<string>();
  /** The firm's limits, for the preview; null until the survey has loaded. */
  readonly limits = input<SlabLimits | null>(null);
  readonly recorded = output<SavedReading>();

  protected readonly kinds = KIND_OPTIONS;
  protected readonly emissionUnits = Object.entries(EMISSION_UNIT_LABELS) as [
    EmissionUnit,
    string,
  ][];
  /** The form element's directive: resetting through it also clears "submitted". */
  private readonly formDirective = viewChild.required(FormGroupDirective);
  protected readonly sending = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected readonly form = inject(NonNullableFormBuilder).group({
    kind: ['relative_humidity' as ReadingKind, Validators.required],
    method: ['hood_hygrometer', Validators.required],
    value: [null as number | null, Validators.required],
    unit: ['lb_per_1000ft2_24h' as EmissionUnit],
    location: ['', Validators.maxLength(200)],
    takenAt: [localNow(), Validators.required],
  });

  private readonly value = toSignal(this.form.valueChanges, {
    initialValue: this.form.getRawValue(),
  });
  protected readonly kind = computed(() => this.value().kind ?? 'relative_humidity');
  protected readonly methods = computed(() => methodOptions(this.kind()));
  protected readonly unit = computed(() => unitLabel(this.kind(), this.value().unit ?? null));
  protected readonly converted = computed(() =>
    otherUnitText(this.kind(), this.value().value ?? null, this.value().unit ?? null),
  );

  /** The verdict this reading would get, or null while it cannot be judged. */
  protected readonly preview = computed<ReadingEvaluation | null>(() => {
    const v = this.value();
    const limits = this.limits();
    if (!limits || v.value === null || v.value === undefined || !v.kind || !v.method) return null;
    const reading = {
      kind: v.kind,
      method: v.method as never,
      value: v.value,
      ...(v.kind === 'moisture_emission' ? { unit: v.unit } : {}),
    };
    return readingProblems(reading).length ? null : evaluateReading(reading, limits);
  });

  /** A new kind takes its first method: a hygrometer cannot measure flatness. */
  protected kindChanged(kind: ReadingKind): void {
    this.form.controls.method.setValue(methodOptions(kind)[0]?.value ?? '');
  }

  protected async record(): Promise<void> {
    this.problem.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    this.sending.set(true);
    try {
      const saved = await this.api.addReading(this.jobId(), {
        kind: v.kind,
        method: v.method,
        value: v.value ?? 0,
        ...(v.kind === 'moisture_emission' ? { unit: v.unit } : {}),
        location: v.location.trim(),
        takenAt: new Date(v.takenAt).toISOString(),
      });
      this.recorded.emit(saved);
      // Ready for the next reading of the same kind; no "enter the reading" on the empty field.
      this.formDirective().resetForm({ ...v, value: null, location: '' });
    } catch (err: unknown) {
      this.problem.set(showProblems(this.form, err));
    } finally {
      this.sending.set(false);
    }
  }

  protected valueError(): string {
    const errors = this.form.controls.value.errors ?? {};
    if (typeof errors['server'] === 'string') return errors['server'];
    return 'Enter the reading.';
  }
}
