import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { errorText } from '../api/api-problems';
import { keyFigures } from './model/key-figures';
import { type SurveyArea, SurveyApi, type TakeoffVersion } from './survey-api';

/**
 * The survey's areas with the key figures of each one's latest takeoff, its earlier versions on
 * request, and the way into the floor editor ("Edit floor", or a new area).
 */
@Component({
  selector: 'lw-survey-areas',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatError,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
  ],
  templateUrl: './survey-areas.html',
  styleUrl: './survey-areas.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SurveyAreas {
  private readonly api = inject(SurveyApi);
  private readonly router = inject(Router);

  readonly jobId = input.required<string>();
  readonly areas = input.required<readonly SurveyArea[]>();
  readonly canEdit = input(false);

  protected readonly figures = keyFigures;
  protected readonly name = new FormControl('', {
    nonNullable: true,
    validators: [Validators.required, Validators.maxLength(120)],
  });
  // A group for the form element: (ngSubmit) needs a form directive to come from.
  protected readonly form = new FormGroup({ name: this.name });
  protected readonly adding = signal(false);
  protected readonly problem = signal<string | null>(null);
  /** Versions shown per area id (loaded when asked for). */
  protected readonly versions = signal<Readonly<Record<string, readonly TakeoffVersion[]>>>({});

  /** Creates the area and opens the floor editor on it. */
  protected async add(): Promise<void> {
    this.problem.set(null);
    if (this.name.invalid) {
      this.name.markAsTouched();
      return;
    }
    this.adding.set(true);
    try {
      const area = await this.api.addArea(this.jobId(), this.name.value.trim());
      await this.router.navigate(['/jobs', this.jobId(), 'areas', area.id]);
    } catch (err: unknown) {
      this.problem.set(errorText(err));
    } finally {
      this.adding.set(false);
    }
  }

  protected async toggleVersions(area: SurveyArea): Promise<void> {
    const shown = this.versions();
    if (shown[area.id]) {
      const { [area.id]: _gone, ...rest } = shown;
      this.versions.set(rest);
      return;
    }
    const list = await this.api.versions(this.jobId(), area.id);
    this.versions.update((v) => ({ ...v, [area.id]: list }));
  }
}
