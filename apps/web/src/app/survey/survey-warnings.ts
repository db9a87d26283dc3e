import { ChangeDetectionStrategy, Component, effect, inject, input, signal } from '@angular/core';
import type { SurveyWarning } from '@latchwork/jobs-domain';
import { SurveyApi } from './survey-api';
import { WarningList } from './warning-list';

/**
 * A compact banner for the job header: the job's failed slab readings with the caution, or
 * nothing at all (also when the survey cannot be read: the survey section says why).
 */
@Component({
  selector: 'lw-survey-warnings',
  imports: [WarningList],
  template: `<lw-warning-list [warnings]="warnings()" [caution]="caution()" [compact]="true" />`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SurveyWarnings {
  private readonly api = inject(SurveyApi);
  /** The job whose survey warnings are shown. */
  readonly jobId = input.required<string>();
  protected readonly warnings = signal<readonly SurveyWarning[]>([]);
  protected readonly caution = signal('');

  constructor() {
    effect(() => {
      this.api.readingsChanged();
      void this.load(this.jobId());
    });
  }

  private async load(jobId: string): Promise<void> {
    try {
      const view = await this.api.surveyQuietly(jobId);
      if (jobId !== this.jobId()) return;
      this.warnings.set(view.surveyWarnings);
      this.caution.set(view.caution);
    } catch {
      this.warnings.set([]);
    }
  }
}
