import { DatePipe } from '@angular/common';
import { HttpClient, HttpContext } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { Subject, catchError, map, of, scan, startWith, switchMap } from 'rxjs';
import { SHOW_ERROR_SNACKBAR } from '../../shell/api-error-interceptor';
import { StatusView, viewOfError, viewOfReport } from './health-report';

/** The page's state: the last answer (kept on screen while a retry runs) and whether one runs. */
interface StatusState {
  readonly checking: boolean;
  readonly view: StatusView | null;
  readonly checkedAt: Date | null;
}

const INITIAL: StatusState = { checking: true, view: null, checkedAt: null };

/** System status: each service Latchwork depends on, up or down, as the API sees it. */
@Component({
  selector: 'lw-status-page',
  imports: [DatePipe, MatButton, MatIcon],
  templateUrl: './status-page.html',
  styleUrl: './status-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StatusPage {
  private readonly http = inject(HttpClient);
  private readonly retries = new Subject<void>();

  protected readonly state = toSignal(
    this.retries.pipe(
      startWith(undefined),
      switchMap(() =>
        this.http
          // The page shows its own error state, so the global snackbar stays quiet.
          .get<unknown>('/api/v1/health', {
            context: new HttpContext().set(SHOW_ERROR_SNACKBAR, false),
          })
          .pipe(
            map(viewOfReport),
            catchError((err: unknown) => of(viewOfError(err))),
            map((view): Partial<StatusState> => ({ checking: false, view, checkedAt: new Date() })),
            startWith<Partial<StatusState>>({ checking: true }),
          ),
      ),
      scan(
        (state: StatusState, change: Partial<StatusState>) => ({ ...state, ...change }),
        INITIAL,
      ),
    ),
    { initialValue: INITIAL },
  );

  /** Asks the API again; an answer still on its way is dropped in favour of the new one. */
  protected retry(): void {
    this.retries.next();
  }
}
