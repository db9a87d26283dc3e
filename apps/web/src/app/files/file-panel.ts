import { DatePipe } from '@angular/common';
import { HttpErrorResponse, HttpEventType } from '@angular/common/http';
import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  effect,
  inject,
  input,
  signal,
} from '@angular/core';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import type { Subscription } from 'rxjs';
import { Session } from '../session/session.store';
import { apiErrorMessage } from '../shell/api-error-interceptor';
import { FileApi, type FileOwnerKind, type StoredFile } from './file-api';
import { ACCEPTED_TYPES, fileProblem, sizeText } from './file-checks';
import { FileThumb } from './file-thumb';

export type { FileOwnerKind } from './file-api';

/** One file being sent (or refused) in this visit. */
interface Upload {
  readonly key: number;
  readonly name: string;
  readonly size: number;
  /** 0–100. */
  readonly progress: number;
  readonly state: 'uploading' | 'done' | 'failed';
  readonly message: string | null;
}

let uploadKey = 0;

/**
 * Upload, list and open the files of a job, site or customer. Files come from a drop zone or a
 * picker, several at a time; each is sent on its own request with its own progress bar, and a
 * refusal (too big, wrong type) stays on its own row.
 */
@Component({
  selector: 'lw-file-panel',
  imports: [DatePipe, FileThumb, MatButton, MatIcon, MatIconButton, MatProgressBar],
  templateUrl: './file-panel.html',
  styleUrl: './file-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FilePanel {
  private readonly api = inject(FileApi);
  private readonly session = inject(Session);
  private readonly running = new Set<Subscription>();

  /** The kind of record the files belong to. */
  readonly ownerKind = input.required<FileOwnerKind>();
  /** The id of that record. */
  readonly ownerId = input.required<string>();

  protected readonly accept = ACCEPTED_TYPES;
  protected readonly size = sizeText;
  protected readonly files = signal<readonly StoredFile[]>([]);
  protected readonly uploads = signal<readonly Upload[]>([]);
  protected readonly listProblem = signal<string | null>(null);
  protected readonly dragging = signal(false);
  protected readonly canUpload = computed(() => this.session.can('jobs:write'));

  constructor() {
    effect(() => void this.load(this.ownerKind(), this.ownerId()));
    inject(DestroyRef).onDestroy(() => this.running.forEach((s) => s.unsubscribe()));
  }

  protected async load(kind = this.ownerKind(), id = this.ownerId()): Promise<void> {
    try {
      const files = await this.api.list(kind, id);
      if (kind === this.ownerKind() && id === this.ownerId()) this.files.set(files);
      this.listProblem.set(null);
    } catch (err: unknown) {
      this.listProblem.set(
        err instanceof HttpErrorResponse ? apiErrorMessage(err) : 'The files could not be listed.',
      );
    }
  }

  protected picked(event: Event): void {
    const input = event.target as HTMLInputElement;
    this.send([...(input.files ?? [])]);
    // The same file may be picked again after a refusal.
    input.value = '';
  }

  protected dragOver(event: DragEvent): void {
    if (!this.canUpload()) return;
    event.preventDefault();
    this.dragging.set(true);
  }

  protected dropped(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(false);
    if (this.canUpload()) this.send([...(event.dataTransfer?.files ?? [])]);
  }

  /** Checks each file and sends the ones that pass, one request each. */
  send(files: File[]): void {
    for (const file of files) {
      const upload: Upload = {
        key: ++uploadKey,
        name: file.name,
        size: file.size,
        progress: 0,
        state: 'uploading',
        message: fileProblem(file),
      };
      if (upload.message) {
        this.uploads.update((list) => [...list, { ...upload, state: 'failed' }]);
        continue;
      }
      this.uploads.update((list) => [...list, upload]);
      const sub = this.api.upload(this.ownerKind(), this.ownerId(), file).subscribe({
        next: (event) => {
          if (event.type === HttpEventType.UploadProgress && event.total)
            this.patch(upload.key, { progress: Math.round((100 * event.loaded) / event.total) });
          if (event.type === HttpEventType.Response) {
            this.patch(upload.key, { progress: 100, state: 'done' });
            void this.load();
          }
        },
        error: (err: unknown) => {
          const message =
            err instanceof HttpErrorResponse ? apiErrorMessage(err) : 'The upload failed.';
          this.patch(upload.key, { state: 'failed', message });
          this.running.delete(sub);
        },
        complete: () => this.running.delete(sub),
      });
      this.running.add(sub);
    }
  }

  /** Clears the rows of finished and refused uploads. */
  protected clearFinished(): void {
    this.uploads.update((list) => list.filter((u) => u.state === 'uploading'));
  }

  protected async open(file: StoredFile): Promise<void> {
    // Opened before the link arrives, so the browser treats it as the click's own window.
    const win = window.open('', '_blank');
    try {
      const url = await this.api.link(file.id);
      if (win) win.location.href = url;
      else window.location.href = url;
    } catch (err: unknown) {
      win?.close();
      this.listProblem.set(
        err instanceof HttpErrorResponse ? apiErrorMessage(err) : 'The file could not be opened.',
      );
    }
  }

  protected async remove(file: StoredFile): Promise<void> {
    if (!window.confirm(`Delete "${file.fileName}"? This cannot be undone.`)) return;
    try {
      await this.api.remove(file.id);
      await this.load();
    } catch (err: unknown) {
      this.listProblem.set(
        err instanceof HttpErrorResponse ? apiErrorMessage(err) : 'The file could not be deleted.',
      );
    }
  }

  private patch(key: number, change: Partial<Upload>): void {
    this.uploads.update((list) => list.map((u) => (u.key === key ? { ...u, ...change } : u)));
  }
}
