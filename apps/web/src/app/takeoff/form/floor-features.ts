import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import type { Point } from '@latchwork/takeoff';
import { FloorEditor } from '../floor-editor.store';
import { LengthInput } from '../length-input';
import { formatCoordinates, parseCoordinates } from '../model/coordinates';
import type {
  DoorwayDraft,
  FloorDraft,
  LevellingDraft,
  ObstacleDraft,
  RectDraft,
} from '../model/floor-draft';
import { formatLength } from '../model/lengths';
import { boundsOf } from '../plan/plan-drawing';
import { inputValue } from './input-value';
import { ProblemList } from './problem-list';
import { RectFields } from './rect-fields';

type ListKey = 'obstacles' | 'doorways' | 'adhesive' | 'levelling';

/** Columns and plinths, doorways, adhesive zones and levelling zones of the floor. */
@Component({
  selector: 'lw-floor-features',
  imports: [
    LengthInput,
    MatButton,
    MatCheckbox,
    MatFormField,
    MatHint,
    MatIcon,
    MatIconButton,
    MatInput,
    MatLabel,
    ProblemList,
    RectFields,
  ],
  templateUrl: './floor-features.html',
  styleUrl: './form-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FloorFeatures {
  protected readonly editor = inject(FloorEditor);
  protected readonly floor = this.editor.floor;
  protected readonly units = this.editor.units;
  protected readonly valueOf = inputValue;
  protected readonly walls = computed(() => {
    const o = this.floor().outline;
    return o.map((p, k) => {
      const q = o[(k + 1) % o.length];
      return {
        k,
        text: `Wall ${k + 1} (${formatLength(Math.hypot(q[0] - p[0], q[1] - p[1]), this.units())})`,
      };
    });
  });

  /** A new rectangle of `size` near the middle of the floor, snapped to 10 mm. */
  private centred(w: number, l: number): RectDraft {
    const b = boundsOf(this.floor().outline);
    const snap = (v: number) => Math.round(v / 10) * 10;
    return { x: snap((b.minX + b.maxX - w) / 2), y: snap((b.minY + b.maxY - l) / 2), w, l };
  }

  protected addColumn(): void {
    this.push('obstacles', { kind: 'rect', ...this.centred(400, 400) });
  }

  protected addPolygon(): void {
    const r = this.centred(600, 600);
    const points: Point[] = [
      [r.x, r.y],
      [r.x + r.w, r.y],
      [r.x + r.w / 2, r.y + r.l],
    ];
    this.push('obstacles', { kind: 'polygon', points });
  }

  protected addDoorway(): void {
    this.push('doorways', { wall: 0, offsetMm: 0, widthMm: 900, ramp: true });
  }

  protected addAdhesive(): void {
    this.push('adhesive', this.centred(2000, 3000));
  }

  protected addLevelling(): void {
    this.push('levelling', { ...this.centred(1000, 1000), depthMm: 5 });
  }

  protected pointsText(points: Point[]): string {
    return formatCoordinates(points, this.units());
  }

  protected setPolygon(k: number, text: string): void {
    const parsed = parseCoordinates(text, this.units());
    if (!parsed.errors.length)
      this.replace('obstacles', k, { kind: 'polygon', points: parsed.points });
  }

  protected setDoorway(k: number, change: Partial<DoorwayDraft>): void {
    this.replace('doorways', k, { ...this.floor().doorways[k], ...change });
  }

  protected setDepth(k: number, depthMm: number): void {
    this.replace('levelling', k, { ...this.floor().levelling[k], depthMm });
  }

  protected setLevelling(k: number, r: RectDraft): void {
    this.replace('levelling', k, { ...this.floor().levelling[k], ...r });
  }

  protected setObstacleRect(k: number, r: RectDraft): void {
    this.replace('obstacles', k, { kind: 'rect', ...r });
  }

  protected replace<K extends ListKey>(key: K, k: number, item: FloorDraft[K][number]): void {
    this.editor.update((f) => ({ ...f, [key]: f[key].map((x, i) => (i === k ? item : x)) }));
  }

  protected remove(key: ListKey, k: number): void {
    this.editor.update((f) => ({ ...f, [key]: f[key].filter((_, i) => i !== k) }));
  }

  private push(key: 'obstacles', item: ObstacleDraft): void;
  private push(key: 'doorways', item: DoorwayDraft): void;
  private push(key: 'adhesive', item: RectDraft): void;
  private push(key: 'levelling', item: LevellingDraft): void;
  private push(key: ListKey, item: unknown): void {
    this.editor.update((f) => ({ ...f, [key]: [...f[key], item] }));
  }
}
