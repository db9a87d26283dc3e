import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  signal,
  untracked,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import type { TakeoffRates } from '@latchwork/takeoff';
import { errorText } from '../../api/api-problems';
import { FloorEditor } from '../floor-editor.store';
import { RATE_GROUPS, type RateField } from './rate-fields';

/**
 * The firm's takeoff rates (owner only): each rate with its unit and the standard value; saving
 * sends only the rates that differ from the standard ones, as the firm's overrides.
 */
@Component({
  selector: 'lw-firm-rates-panel',
  imports: [MatButton, MatFormField, MatHint, MatInput, MatLabel, MatOption, MatSelect],
  templateUrl: './firm-rates-panel.html',
  styles: `
    .group {
      display: flex;
      flex-wrap: wrap;
      gap: 0 8px;
    }
    .group mat-form-field {
      flex: 1 1 150px;
    }
    h4 {
      margin: 8px 0 4px;
      font: var(--mat-sys-title-small);
    }
    .note {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .bad {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FirmRatesPanel {
  private readonly editor = inject(FloorEditor);
  protected readonly groups = RATE_GROUPS;
  protected readonly rates = this.editor.firmRates;
  /** What is typed, per rate. */
  protected readonly text = signal<Record<string, string>>({});
  protected readonly anchoring = signal<TakeoffRates['anchoring']>('tape');
  protected readonly saving = signal(false);
  protected readonly message = signal<string | null>(null);

  /** The rates as entered, or the first field that is not a number. */
  private readonly entered = computed(() => {
    const defaults = this.rates()?.defaults;
    if (!defaults) return { overrides: null, bad: null };
    const overrides: Partial<Record<keyof TakeoffRates, unknown>> = {};
    for (const field of RATE_GROUPS.flatMap((g) => g.fields)) {
      const value = Number(this.text()[field.key]);
      if (!Number.isFinite(value) || value < 0 || (field.whole && !Number.isInteger(value)))
        return { overrides: null, bad: field.label };
      if (value !== defaults[field.key]) overrides[field.key] = value;
    }
    if (this.anchoring() !== defaults.anchoring) overrides.anchoring = this.anchoring();
    return { overrides: overrides as Partial<TakeoffRates>, bad: null };
  });
  protected readonly bad = computed(() => this.entered().bad);

  constructor() {
    effect(() => {
      const rates = this.rates();
      if (!rates) return;
      untracked(() => {
        const text: Record<string, string> = {};
        for (const f of RATE_GROUPS.flatMap((g) => g.fields))
          text[f.key] = String(rates.effective[f.key]);
        this.text.set(text);
        this.anchoring.set(rates.effective.anchoring);
      });
    });
  }

  protected set(field: RateField, e: Event): void {
    const value = (e.target as HTMLInputElement).value;
    this.text.update((t) => ({ ...t, [field.key]: value }));
  }

  protected async save(): Promise<void> {
    const { overrides } = this.entered();
    if (!overrides) return;
    this.saving.set(true);
    this.message.set(null);
    try {
      await this.editor.saveRates(overrides);
      this.message.set('Firm rates saved: this takeoff and new ones use them.');
    } catch (err: unknown) {
      this.message.set(errorText(err));
    } finally {
      this.saving.set(false);
    }
  }
}
