import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { errorText } from '../../api/api-problems';
import { CustomersApi, ImportCounts, ImportKind, ImportPreview as Preview } from '../customers-api';
import { ImportPreview } from './import-preview';

/** The API takes JSON bodies up to 1 MB; the CSV text must fit inside one. */
export const MAX_CSV_CHARS = 950_000;

/**
 * Imports customers or sites from a CSV file: pick or drop the file, see what would happen
 * row by row, fix errors in the file, and only then confirm. Nothing is written before that.
 */
@Component({
  selector: 'lw-customer-import-page',
  imports: [RouterLink, MatButton, MatIcon, MatRadioButton, MatRadioGroup, ImportPreview],
  templateUrl: './customer-import-page.html',
  styleUrl: './customer-import-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CustomerImportPage {
  private readonly api = inject(CustomersApi);

  protected readonly kind = signal<ImportKind>('customers');
  protected readonly fileName = signal<string | null>(null);
  protected readonly preview = signal<Preview | null>(null);
  protected readonly result = signal<ImportCounts | null>(null);
  protected readonly busy = signal(false);
  protected readonly dragging = signal(false);
  protected readonly problem = signal<string | null>(null);
  private csv = '';

  /** Confirm only a preview of this file and kind, with no errors and something to write. */
  protected readonly canConfirm = computed(() => {
    const p = this.preview();
    return (
      !this.busy() &&
      p !== null &&
      p.kind === this.kind() &&
      p.counts.error === 0 &&
      p.counts.create + p.counts.update > 0
    );
  });

  protected async kindChanged(kind: ImportKind): Promise<void> {
    this.kind.set(kind);
    if (this.csv) await this.runPreview();
  }

  protected async picked(event: Event): Promise<void> {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (file) await this.read(file);
  }

  protected async dropped(event: DragEvent): Promise<void> {
    event.preventDefault();
    this.dragging.set(false);
    const file = event.dataTransfer?.files[0];
    if (file) await this.read(file);
  }

  protected dragOver(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(true);
  }

  protected async confirm(): Promise<void> {
    if (!this.canConfirm()) return;
    this.busy.set(true);
    this.problem.set(null);
    try {
      const done = await firstValueFrom(this.api.commitImport(this.kind(), this.csv));
      this.result.set(done.counts);
      this.preview.set(null);
      this.csv = '';
    } catch (err: unknown) {
      this.problem.set(errorText(err));
      // The firm's data or the file may differ from what was previewed: show the new plan.
      await this.runPreview();
    } finally {
      this.busy.set(false);
    }
  }

  private async read(file: File): Promise<void> {
    this.result.set(null);
    this.preview.set(null);
    this.problem.set(null);
    this.fileName.set(file.name);
    const text = await file.text();
    if (text.length > MAX_CSV_CHARS) {
      this.csv = '';
      this.problem.set(
        `${file.name} is larger than about 1 MB. Split it into smaller files of a few thousand rows each.`,
      );
      return;
    }
    this.csv = text;
    await this.runPreview();
  }

  private async runPreview(): Promise<void> {
    this.busy.set(true);
    try {
      this.preview.set(await firstValueFrom(this.api.previewImport(this.kind(), this.csv)));
    } catch (err: unknown) {
      this.preview.set(null);
      this.problem.set(errorText(err));
    } finally {
      this.busy.set(false);
    }
  }
}
