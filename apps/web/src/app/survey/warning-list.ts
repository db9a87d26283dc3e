import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import type { SurveyWarning } from '@latchwork/jobs-domain';

/**
 * The failed-reading warnings of a job with the caution that our advice does not replace the
 * rules that apply; nothing at all when there are none. `compact` gives one line per warning
 * (the job header), otherwise the whole sentence and the source.
 */
@Component({
  selector: 'lw-warning-list',
  imports: [MatIcon],
  template: `@if (warnings().length) {
    <section class="wl" [class.wl--compact]="compact()" role="status" aria-label="Survey warnings">
      <mat-icon class="wl__icon" aria-hidden="true">report</mat-icon>
      <div>
        <ul class="wl__list">
          @for (w of warnings(); track w.kind) {
            <li>
              <strong>{{ w.title }}</strong>
              @if (compact()) {
                — {{ w.failed }} of {{ w.total }} readings failed.
              } @else {
                — {{ w.message }} <span class="wl__source">Limit: {{ w.source }}.</span>
              }
            </li>
          }
        </ul>
        @if (compact()) {
          <p class="wl__caution">{{ caution() }}</p>
        }
      </div>
    </section>
  }`,
  styles: `
    .wl {
      display: flex;
      gap: 12px;
      padding: 12px 16px;
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
    .wl__icon {
      flex: none;
    }
    .wl--compact {
      padding: 8px 12px;
    }
    .wl__list {
      margin: 0;
      padding: 0;
      list-style: none;
    }
    .wl__list li + li {
      margin-top: 4px;
    }
    .wl__source,
    .wl__caution {
      font: var(--mat-sys-body-small);
    }
    .wl__caution {
      margin: 4px 0 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WarningList {
  readonly warnings = input.required<readonly SurveyWarning[]>();
  readonly caution = input('');
  readonly compact = input(false);
}
