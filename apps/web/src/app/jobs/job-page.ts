import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatMenu, MatMenuItem, MatMenuTrigger } from '@angular/material/menu';
import { MatTab, MatTabContent, MatTabGroup } from '@angular/material/tabs';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { STAGE_LABELS, type Stage } from '@latchwork/jobs-domain';
import { errorText } from '../api/api-problems';
import { moneyText } from '../customers/money-text';
import { FilePanel } from '../files/file-panel';
import { Session } from '../session/session.store';
import { JobSurvey } from '../survey/job-survey';
import { SurveyWarnings } from '../survey/survey-warnings';
import { JobMover } from './job-mover';
import { JobTimeline } from './job-timeline';
import { JobsApi, type JobHeader, type StageMove } from './jobs-api';

/**
 * One job: reference, customer, site, stage (with a menu of the moves it may make), value,
 * owner and dates, the survey's warnings, then tabs for the timeline with notes, the site
 * survey and the files.
 */
@Component({
  selector: 'lw-job-page',
  imports: [
    DatePipe,
    FilePanel,
    JobSurvey,
    JobTimeline,
    MatButton,
    MatIcon,
    MatMenu,
    MatMenuItem,
    MatMenuTrigger,
    MatTab,
    MatTabContent,
    MatTabGroup,
    RouterLink,
    SurveyWarnings,
  ],
  templateUrl: './job-page.html',
  styleUrl: './job-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobPage {
  private readonly api = inject(JobsApi);
  private readonly mover = inject(JobMover);
  private readonly session = inject(Session);

  protected readonly id = inject(ActivatedRoute).snapshot.paramMap.get('jobId') ?? '';
  protected readonly labels = STAGE_LABELS;
  protected readonly job = signal<JobHeader | null>(null);
  protected readonly history = signal<StageMove[]>([]);
  protected readonly problem = signal<string | null>(null);
  /** Bumped after a move so the timeline reloads. */
  protected readonly version = signal(0);
  protected readonly canWrite = computed(() => this.session.can('jobs:write'));
  private readonly currency = computed(() => this.session.activeTenant()?.currency ?? 'GBP');

  constructor() {
    void this.load();
  }

  protected money(minor: number | null): string {
    return moneyText(minor, this.currency());
  }

  protected async moveTo(to: Stage): Promise<void> {
    const job = this.job();
    if (!job) return;
    const outcome = await this.mover.move(job, to);
    if (!outcome.moved) return;
    this.job.set(outcome.job);
    this.version.update((v) => v + 1);
    await this.loadHistory();
  }

  private async load(): Promise<void> {
    try {
      this.job.set(await firstValueFrom(this.api.get(this.id)));
      await this.loadHistory();
    } catch (err: unknown) {
      this.problem.set(errorText(err));
    }
  }

  private async loadHistory(): Promise<void> {
    this.history.set(await firstValueFrom(this.api.history(this.id)));
  }
}
