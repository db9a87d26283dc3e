import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { MatOption, MatSelect } from '@angular/material/select';
import { FloorEditor } from '../floor-editor.store';
import { LengthInput } from '../length-input';
import {
  type OriginDraft,
  PITCH_PRESETS_MM,
  type PatternDraft,
  type PatternKind,
  type RectDraft,
} from '../model/floor-draft';
import { formatLength } from '../model/lengths';
import { inputValue } from './input-value';
import { ProblemList } from './problem-list';
import { RectFields } from './rect-fields';

/** Tile pitch, gap, where the grid starts, and the colour pattern. */
@Component({
  selector: 'lw-layout-settings',
  imports: [
    LengthInput,
    MatButton,
    MatButtonToggle,
    MatButtonToggleGroup,
    MatFormField,
    MatHint,
    MatIcon,
    MatIconButton,
    MatInput,
    MatLabel,
    MatOption,
    MatRadioButton,
    MatRadioGroup,
    MatSelect,
    ProblemList,
    RectFields,
  ],
  templateUrl: './layout-settings.html',
  styleUrl: './form-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LayoutSettings {
  protected readonly editor = inject(FloorEditor);
  protected readonly floor = this.editor.floor;
  protected readonly units = this.editor.units;
  protected readonly valueOf = inputValue;
  protected readonly pattern = computed(() => this.floor().pattern);
  protected readonly presets = PITCH_PRESETS_MM.map((mm) => ({
    mm,
    label: this.units() === 'imperial' ? formatLength(mm, 'imperial') : `${mm}`,
  }));
  protected readonly preset = computed(() =>
    PITCH_PRESETS_MM.includes(this.floor().pitchMm) ? this.floor().pitchMm : null,
  );
  protected readonly kinds: { value: PatternKind; label: string }[] = [
    { value: 'single', label: 'Single colour' },
    { value: 'border', label: 'Border' },
    { value: 'chequer', label: 'Chequer' },
    { value: 'stripes', label: 'Stripes' },
    { value: 'bays', label: 'Painted bays' },
  ];

  protected setPitch(mm: number): void {
    this.editor.update((f) => ({ ...f, pitchMm: mm }));
  }

  protected setGap(mm: number): void {
    this.editor.update((f) => ({ ...f, gapMm: mm }));
  }

  protected setOriginMode(mode: OriginDraft['mode']): void {
    this.editor.update((f) => {
      if (mode !== 'point') return { ...f, origin: { mode } };
      // Start a picked origin where the grid is now, so switching changes nothing yet.
      const at = this.editor.result()?.origin ?? {
        x: f.outline[0]?.[0] ?? 0,
        y: f.outline[0]?.[1] ?? 0,
      };
      return { ...f, origin: { mode: 'point', x: at.x, y: at.y } };
    });
  }

  protected setOriginAxis(axis: 'x' | 'y', mm: number): void {
    this.editor.update((f) =>
      f.origin.mode === 'point' ? { ...f, origin: { ...f.origin, [axis]: mm } } : f,
    );
  }

  /** The grid starts at the corner of the walls nearest the drawing's origin. */
  protected atWallCorner(): void {
    this.editor.update((f) => {
      const corner = f.outline.reduce(
        (a, b) => (Math.hypot(...b) < Math.hypot(...a) ? b : a),
        f.outline[0] ?? [0, 0],
      );
      return { ...f, origin: { mode: 'point', x: corner[0], y: corner[1] } };
    });
  }

  protected setPattern(change: Partial<PatternDraft>): void {
    this.editor.update((f) => ({ ...f, pattern: { ...f.pattern, ...change } }));
  }

  protected addBay(): void {
    const p = this.pattern();
    this.setPattern({
      bays: [...p.bays, { x: 0, y: 0, w: 2500, l: 5000, colour: 'Signal yellow' }],
    });
  }

  protected setBay(k: number, change: Partial<RectDraft & { colour: string }>): void {
    const bays = this.pattern().bays.map((b, i) => (i === k ? { ...b, ...change } : b));
    this.setPattern({ bays });
  }

  protected removeBay(k: number): void {
    this.setPattern({ bays: this.pattern().bays.filter((_, i) => i !== k) });
  }

  protected whole(text: string, fallback: number): number {
    const n = Number(text);
    return Number.isInteger(n) && n >= 1 ? n : fallback;
  }
}
