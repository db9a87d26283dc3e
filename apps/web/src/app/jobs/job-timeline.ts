import { DatePipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  computed,
  effect,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatAutocomplete, MatAutocompleteTrigger } from '@angular/material/autocomplete';
import { MatButton } from '@angular/material/button';
import { MatOption } from '@angular/material/core';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { catchError, firstValueFrom, of } from 'rxjs';
import { errorText } from '../api/api-problems';
import { Session } from '../session/session.store';
import { JobsApi, type TeamMember, type TimelineEvent } from './jobs-api';
import { insertMention, mentionAt, mentionCandidates, type MentionQuery } from './mention-text';

const ICONS: Record<string, string> = {
  created: 'flag',
  'stage-move': 'east',
  note: 'sticky_note_2',
  'email-queued': 'mail',
  updated: 'edit',
};

/**
 * What happened to a job, newest first, a page at a time; writers add notes above it, and
 * naming a colleague with @ (picked from a list as you type) e-mails them a link to the job.
 */
@Component({
  selector: 'lw-job-timeline',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    MatAutocomplete,
    MatAutocompleteTrigger,
    MatButton,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
  ],
  templateUrl: './job-timeline.html',
  styleUrl: './job-timeline.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobTimeline {
  private readonly api = inject(JobsApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(Session);

  /** The job whose timeline is shown. */
  readonly jobId = input.required<string>();
  /** Bumped by the page after a move, so the new line shows. */
  readonly version = input(0);

  protected readonly canWrite = computed(() => this.session.can('jobs:write'));
  protected readonly events = signal<TimelineEvent[]>([]);
  protected readonly nextBefore = signal<string | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly saving = signal(false);
  protected readonly note = new FormControl('', {
    nonNullable: true,
    validators: [Validators.required, Validators.maxLength(10_000)],
  });
  private readonly team = toSignal(this.api.team().pipe(catchError(() => of([]))), {
    initialValue: [] as TeamMember[],
  });
  private readonly box = viewChild<ElementRef<HTMLTextAreaElement>>('box');
  protected readonly mention = signal<MentionQuery | null>(null);
  /** The note and caret as last typed (the list overwrites the field when a name is picked). */
  private draft = { text: '', caret: 0 };
  protected readonly candidates = computed(() => {
    const m = this.mention();
    return m ? mentionCandidates(this.team(), m.query) : [];
  });

  constructor() {
    effect(() => {
      this.version();
      void this.load(this.jobId());
    });
  }

  protected icon(kind: string): string {
    return ICONS[kind] ?? 'info';
  }

  /** Follows the caret: a list of names opens while an @-mention is being typed. */
  protected typed(): void {
    const el = this.box()?.nativeElement;
    if (!el) return;
    this.draft = { text: el.value, caret: el.selectionStart ?? el.value.length };
    this.mention.set(mentionAt(this.draft.text, this.draft.caret));
  }

  /** Picking a name puts "@Name " where the mention was typed, whatever the list wrote. */
  protected mentioned(member: TeamMember): void {
    const el = this.box()?.nativeElement;
    const m = this.mention();
    if (!el || !m) return;
    const next = insertMention(this.draft.text, m, this.draft.caret, member.name);
    this.note.setValue(next.text);
    this.mention.set(null);
    // After the autocomplete has written its own value, put ours back and the caret after it.
    setTimeout(() => {
      el.value = next.text;
      el.setSelectionRange(next.caret, next.caret);
      el.focus();
    });
  }

  protected async save(): Promise<void> {
    if (this.note.invalid || !this.note.value.trim() || this.saving()) return;
    this.saving.set(true);
    try {
      const added = await firstValueFrom(this.api.addNote(this.jobId(), this.note.value));
      this.note.reset();
      const told = added.emailed.map((e) => e.name);
      this.snackBar.open(
        told.length ? `Note added; e-mailed ${told.join(', ')}.` : 'Note added.',
        'OK',
        {
          duration: 5000,
        },
      );
      await this.load(this.jobId());
    } catch (err: unknown) {
      this.problem.set(errorText(err));
    } finally {
      this.saving.set(false);
    }
  }

  protected async more(): Promise<void> {
    const before = this.nextBefore();
    if (before) await this.load(this.jobId(), before);
  }

  private async load(jobId: string, before?: string): Promise<void> {
    try {
      const page = await firstValueFrom(this.api.timeline(jobId, before));
      this.events.update((list) => (before ? [...list, ...page.items] : page.items));
      this.nextBefore.set(page.nextBefore);
      this.problem.set(null);
    } catch (err: unknown) {
      this.problem.set(errorText(err));
    }
  }
}
