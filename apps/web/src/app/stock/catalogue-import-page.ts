import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { errorText } from '../api/api-problems';
import { ImportPreview, StockApi } from './stock-api';

/**
 * Import the catalogue from CSV: choose or paste the file, see each row's problems (row,
 * column, why) and what it would do, then import — all rows or none.
 */
@Component({
  selector: 'lw-catalogue-import-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
  ],
  templateUrl: './catalogue-import-page.html',
  styleUrl: './stock-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CatalogueImportPage {
  private readonly api = inject(StockApi);
  protected readonly csv = new FormControl('', { nonNullable: true });
  protected readonly preview = signal<ImportPreview | null>(null);
  protected readonly done = signal<string | null>(null);
  protected readonly problem = signal<string | null>(null);

  protected async chosen(event: Event): Promise<void> {
    const file = (event.target as HTMLInputElement).files?.[0];
    if (file) this.csv.setValue(await file.text());
    this.check();
  }

  protected check(): void {
    this.done.set(null);
    this.api.previewImport(this.csv.value).subscribe({
      next: (p) => {
        this.preview.set(p);
        this.problem.set(null);
      },
      error: (err: unknown) => this.problem.set(errorText(err)),
    });
  }

  protected confirm(): void {
    this.api.confirmImport(this.csv.value).subscribe({
      next: (r) => {
        this.done.set(`Imported: ${r.summary.create} new, ${r.summary.update} updated.`);
        this.preview.set(null);
      },
      error: (err: unknown) => this.problem.set(errorText(err)),
    });
  }
}
