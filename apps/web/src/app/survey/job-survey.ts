import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/** The site survey of one job: details, areas with takeoff versions, slab readings. */
@Component({
  selector: 'lw-job-survey',
  template: `<section class="lw-job-survey" aria-label="Site survey">
    <h2>Site survey</h2>
    <p>Survey for job {{ jobId() }} is loading…</p>
  </section>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobSurvey {
  /** The job whose survey is shown. */
  readonly jobId = input.required<string>();
}
