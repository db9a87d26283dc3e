import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  signal,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import { errorText } from '../api/api-problems';
import { Session } from '../session/session.store';
import { ReadingForm } from './reading-form';
import { ReadingsTable } from './readings-table';
import { type JobSurveyView, type SavedReading, SurveyApi } from './survey-api';
import { SurveyAreas } from './survey-areas';
import { SurveyDetailsForm } from './survey-details-form';
import { WarningList } from './warning-list';

/**
 * The site survey of one job: details, areas with their takeoff versions (into the floor
 * editor), and slab readings judged against the firm's limits, with the warnings they raise.
 */
@Component({
  selector: 'lw-job-survey',
  imports: [MatButton, ReadingForm, ReadingsTable, SurveyAreas, SurveyDetailsForm, WarningList],
  templateUrl: './job-survey.html',
  styleUrl: './job-survey.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobSurvey {
  private readonly api = inject(SurveyApi);
  private readonly session = inject(Session);

  /** The job whose survey is shown. */
  readonly jobId = input.required<string>();

  protected readonly view = signal<JobSurveyView | null>(null);
  protected readonly loadProblem = signal<string | null>(null);
  protected readonly readingProblem = signal<string | null>(null);
  protected readonly canWrite = computed(() => this.session.can('jobs:write'));

  constructor() {
    effect(() => void this.load(this.jobId()));
  }

  protected async load(jobId = this.jobId()): Promise<void> {
    try {
      const view = await this.api.survey(jobId);
      if (jobId === this.jobId()) this.view.set(view);
      this.loadProblem.set(null);
    } catch (err: unknown) {
      this.loadProblem.set(errorText(err));
    }
  }

  protected async readingsChanged(): Promise<void> {
    this.api.readingsChanged.update((n) => n + 1);
    await this.load();
  }

  protected async removeReading(r: SavedReading): Promise<void> {
    this.readingProblem.set(null);
    try {
      await this.api.deleteReading(this.jobId(), r.id);
      await this.readingsChanged();
    } catch (err: unknown) {
      this.readingProblem.set(errorText(err));
    }
  }
}
