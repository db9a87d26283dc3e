import { Injectable, inject } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import { firstValueFrom } from 'rxjs';
import { STAGE_LABELS, type Stage } from '@latchwork/jobs-domain';
import { errorText } from '../api/api-problems';
import { JobsApi, type JobHeader, type JobRow } from './jobs-api';
import { planDrop } from './board-moves';
import { ReasonDialog, type ReasonDialogData } from './reason-dialog';

/** Whether a move was made, and the job as it now is. */
export type MoveOutcome = { moved: true; job: JobHeader } | { moved: false };

/**
 * One way to move a job, for the board's drag and the menus of cards and the job page: check
 * it as the API will, ask for a reason where one is needed, send it, and say in a snack bar
 * why it was refused (by the stage table here or by the API).
 */
@Injectable({ providedIn: 'root' })
export class JobMover {
  private readonly api = inject(JobsApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  /**
   * Moves the job to `to`; `beforeSend` runs once the move is certain to be sent (the board
   * moves the card there, so it does not wait for the answer). Never throws.
   */
  async move(
    job: Pick<JobRow, 'id' | 'reference' | 'stage' | 'heldFrom'>,
    to: Stage,
    beforeSend?: () => void,
  ): Promise<MoveOutcome> {
    const plan = planDrop(job, to);
    if (plan.kind === 'stay') return { moved: false };
    if (plan.kind === 'refuse') {
      this.tell(plan.message);
      return { moved: false };
    }
    let reason: string | null = null;
    if (plan.kind === 'ask-reason') {
      const data: ReasonDialogData = {
        title: `Move ${job.reference} to ${STAGE_LABELS[to]}`,
        prompt: plan.prompt,
      };
      const answer = await firstValueFrom(
        this.dialog
          .open<ReasonDialog, ReasonDialogData, string>(ReasonDialog, { data })
          .afterClosed(),
      );
      if (!answer) return { moved: false };
      reason = answer;
    }
    beforeSend?.();
    try {
      const moved = await firstValueFrom(this.api.move(job.id, to, reason));
      return { moved: true, job: moved };
    } catch (err: unknown) {
      this.tell(errorText(err));
      return { moved: false };
    }
  }

  private tell(message: string): void {
    this.snackBar.open(message, 'OK', { duration: 8000 });
  }
}
