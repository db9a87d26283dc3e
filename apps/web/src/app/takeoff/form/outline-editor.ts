import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  signal,
  untracked,
} from '@angular/core';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatTab, MatTabGroup } from '@angular/material/tabs';
import { FloorEditor } from '../floor-editor.store';
import { formatCoordinates, parseCoordinates } from '../model/coordinates';
import { rectPoints } from '../model/floor-draft';
import { formatLength } from '../model/lengths';
import { type Wall, type Walk, closeWalk, pointsFromWalk } from '../model/wall-walk';
import { LengthInput } from '../length-input';
import { boundsOf } from '../plan/plan-drawing';
import { inputValue } from './input-value';
import { ProblemList } from './problem-list';

const TABS = ['rectangle', 'walls', 'points'] as const;

/** The floor's outline, three ways: a rectangle, a walk round the walls, or coordinates. */
@Component({
  selector: 'lw-outline-editor',
  imports: [
    LengthInput,
    MatButton,
    MatFormField,
    MatHint,
    MatIcon,
    MatIconButton,
    MatInput,
    MatLabel,
    MatSuffix,
    MatTab,
    MatTabGroup,
    ProblemList,
  ],
  templateUrl: './outline-editor.html',
  styleUrl: './form-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OutlineEditor {
  protected readonly editor = inject(FloorEditor);
  protected readonly floor = this.editor.floor;
  protected readonly units = this.editor.units;
  protected readonly valueOf = inputValue;
  protected readonly tab = signal(TABS.indexOf(this.floor().source));

  protected readonly size = computed(() => {
    const b = boundsOf(this.floor().outline);
    return { w: b.maxX - b.minX, l: b.maxY - b.minY };
  });
  protected readonly walk = computed(() => this.floor().walk);
  protected readonly gapMm = computed(() => pointsFromWalk(this.walk()).gapMm);
  protected readonly gapText = computed(() => formatLength(this.gapMm(), this.units()));

  /** The coordinates as typed; rewritten only when the outline changes some other way. */
  protected readonly coordsText = signal('');
  protected readonly coordErrors = signal<string[]>([]);
  private typedOutline: unknown = null;

  constructor() {
    effect(() => {
      const f = this.floor();
      if (f.outline === this.typedOutline) return;
      untracked(() => {
        this.coordsText.set(formatCoordinates(f.outline, f.units));
        this.coordErrors.set([]);
      });
    });
  }

  protected setRectangle(w: number, l: number): void {
    if (w > 0 && l > 0) this.editor.setOutline(rectPoints({ x: 0, y: 0, w, l }), 'rectangle');
  }

  protected onCoords(text: string): void {
    this.coordsText.set(text);
    const parsed = parseCoordinates(text, this.units());
    this.coordErrors.set(parsed.errors.map((e) => e.message));
    if (parsed.errors.length) return;
    this.typedOutline = parsed.points;
    this.editor.setOutline(parsed.points, 'points');
  }

  protected setWalk(walk: Walk): void {
    const { points } = pointsFromWalk(walk);
    this.editor.update((f) => ({ ...f, walk, outline: points, source: 'walls' }));
  }

  protected setWall(k: number, change: Partial<Wall>): void {
    const walk = this.walk();
    this.setWalk({ ...walk, walls: walk.walls.map((w, i) => (i === k ? { ...w, ...change } : w)) });
  }

  protected addWall(): void {
    const walk = this.walk();
    this.setWalk({
      ...walk,
      walls: [...walk.walls, { lengthMm: 1000, turnDeg: 90, turn: 'left' }],
    });
  }

  protected removeWall(k: number): void {
    const walk = this.walk();
    this.setWalk({ ...walk, walls: walk.walls.filter((_, i) => i !== k) });
  }

  protected close(): void {
    this.setWalk(closeWalk(this.walk()));
  }

  protected setTurn(k: number, text: string): void {
    const deg = Number(text);
    if (Number.isFinite(deg) && deg >= 0 && deg <= 180) this.setWall(k, { turnDeg: deg });
  }

  protected setHeading(text: string): void {
    const deg = Number(text);
    if (Number.isFinite(deg)) this.setWalk({ ...this.walk(), headingDeg: deg });
  }

  protected setStart(axis: 0 | 1, mm: number): void {
    const start = this.walk().start.slice() as [number, number];
    start[axis] = mm;
    this.setWalk({ ...this.walk(), start });
  }
}
