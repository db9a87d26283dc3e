import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/** A compact banner for the job header: failed slab readings, or nothing at all. */
@Component({
  selector: 'lw-survey-warnings',
  template: ``,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SurveyWarnings {
  /** The job whose survey warnings are shown. */
  readonly jobId = input.required<string>();
}
