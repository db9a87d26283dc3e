import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { CdkDrag, CdkDragDrop, CdkDropList, CdkDropListGroup } from '@angular/cdk/drag-drop';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatMenu, MatMenuItem, MatMenuTrigger } from '@angular/material/menu';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { catchError, distinctUntilChanged, firstValueFrom, map, of, switchMap, tap } from 'rxjs';
import { canMove, nextStages, STAGE_LABELS, type Stage } from '@latchwork/jobs-domain';
import { errorText } from '../api/api-problems';
import { moneyText } from '../customers/money-text';
import { Session } from '../session/session.store';
import { withCardMoved } from './board-moves';
import { filtersFromParams, hasFilters } from './job-filters';
import { JobFilterBar } from './job-filter-bar';
import { JobMover } from './job-mover';
import { JobsApi, type Board, type BoardColumn, type JobRow } from './jobs-api';
import { NewJobDialog } from './new-job-dialog';

/**
 * The pipeline as a board: a column per stage with its count and value, cards newest move
 * first. Dragging a card (or its menu, for keyboards and small screens) moves the job; the
 * stage table is checked here first, so a refused move snaps back at once with the reason.
 */
@Component({
  selector: 'lw-job-board-page',
  imports: [
    CdkDrag,
    CdkDropList,
    CdkDropListGroup,
    JobFilterBar,
    MatButton,
    MatIcon,
    MatIconButton,
    MatMenu,
    MatMenuItem,
    MatMenuTrigger,
    RouterLink,
  ],
  templateUrl: './job-board-page.html',
  styleUrls: ['./job-views.scss', './job-board-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobBoardPage {
  private readonly api = inject(JobsApi);
  private readonly mover = inject(JobMover);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly session = inject(Session);

  protected readonly labels = STAGE_LABELS;
  protected readonly canWrite = computed(() => this.session.can('jobs:write'));
  private readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');
  protected readonly filters = toSignal(this.route.queryParamMap.pipe(map(filtersFromParams)), {
    initialValue: filtersFromParams(this.route.snapshot.queryParamMap),
  });
  protected readonly filtered = computed(() => hasFilters(this.filters()));
  protected readonly loading = signal(true);
  protected readonly problem = signal<string | null>(null);
  /** The board as shown: the server's answer, then moved cards and more cards added here. */
  protected readonly board = signal<Board | null>(null);
  /** The card being dragged, so columns it may not go to are shown as such. */
  protected readonly dragging = signal<JobRow | null>(null);

  constructor() {
    toObservable(this.filters)
      .pipe(
        distinctUntilChanged((a, b) => JSON.stringify(a) === JSON.stringify(b)),
        tap(() => this.loading.set(true)),
        switchMap((f) =>
          this.api.board(f).pipe(
            tap(() => this.problem.set(null)),
            catchError((err: unknown) => {
              this.problem.set(errorText(err));
              return of(null);
            }),
          ),
        ),
      )
      .subscribe((board) => {
        this.board.set(board);
        this.loading.set(false);
      });
  }

  protected money(minor: number | null): string {
    return moneyText(minor, this.currency());
  }

  protected stagesFor(card: JobRow): Stage[] {
    return nextStages(card.stage, card.heldFrom);
  }

  /** While a card is dragged: may it go to this column (a reason may still be asked)? */
  protected refuses(column: BoardColumn): boolean {
    const card = this.dragging();
    return (
      !!card && card.stage !== column.stage && !canMove(card.stage, column.stage, card.heldFrom)
    );
  }

  protected dropped(event: CdkDragDrop<Stage, Stage, JobRow>): void {
    this.dragging.set(null);
    void this.moveCard(event.item.data, event.container.data);
  }

  /** Moves a card; on refusal (here or by the API) the board is put back as it was. */
  async moveCard(card: JobRow, to: Stage): Promise<void> {
    const before = this.board();
    if (!before) return;
    const outcome = await this.mover.move(card, to, () =>
      this.board.set({ ...before, columns: withCardMoved(before.columns, card.id, to) }),
    );
    if (!outcome.moved) this.board.set(before);
  }

  protected async more(column: BoardColumn): Promise<void> {
    try {
      const next = await firstValueFrom(
        this.api.column(this.filters(), column.stage, column.cards.length),
      );
      this.board.update(
        (b) =>
          b && {
            ...b,
            columns: b.columns.map((c) =>
              c.stage === column.stage
                ? { ...c, cards: [...c.cards, ...next.cards], more: next.more }
                : c,
            ),
          },
      );
    } catch (err: unknown) {
      this.problem.set(errorText(err));
    }
  }

  protected newJob(): void {
    this.dialog
      .open(NewJobDialog, { width: '560px', maxWidth: '100vw' })
      .afterClosed()
      .subscribe((id?: string) => {
        if (id) void this.router.navigate([id], { relativeTo: this.route });
      });
  }

  protected clearFilters(): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: {} });
  }
}
