import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  computed,
  effect,
  inject,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import type { Point } from '@latchwork/takeoff';
import { FloorEditor } from '../floor-editor.store';
import { doorwayEnds, rectPoints } from '../model/floor-draft';
import { formatLength } from '../model/lengths';
import { planDescription } from './plan-description';
import {
  boundsOf,
  cutShapes,
  fullTileLayers,
  polygonPath,
  regionPath,
  wallDimensions,
} from './plan-drawing';
import { type ViewBox, fitView, mmPerPixel, panView, snap10, zoomView } from './plan-viewport';

type Drag =
  | { kind: 'pan'; lastPx: Point; moved: boolean }
  | { kind: 'vertex'; index: number }
  | null;

/**
 * The plan: tiles, cuts, obstacles, doorways and zones drawn from the engine's geometry, with
 * pan (drag empty space), zoom (wheel, buttons, + and − keys), vertex dragging on a 10 mm snap,
 * and a pick-the-origin mode. With focus, ← and → step through the cut tiles and announce each.
 */
@Component({
  selector: 'lw-floor-plan',
  imports: [MatButton, MatIcon, MatIconButton],
  templateUrl: './floor-plan.html',
  styleUrl: './floor-plan.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FloorPlan {
  protected readonly editor = inject(FloorEditor);
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');

  protected readonly floor = this.editor.floor;
  protected readonly result = this.editor.result;
  protected readonly plan = computed(() => this.result()?.plan ?? null);
  protected readonly layers = computed(() => {
    const plan = this.plan();
    return plan ? fullTileLayers(plan) : [];
  });
  protected readonly cuts = computed(() => {
    const plan = this.plan();
    return plan ? cutShapes(plan) : [];
  });
  protected readonly region = computed(() => {
    const plan = this.plan();
    return plan ? regionPath(plan) : '';
  });
  protected readonly outlinePath = computed(() => polygonPath(this.floor().outline));
  protected readonly obstacles = computed(() =>
    this.floor().obstacles.map((o) => polygonPath(o.kind === 'rect' ? rectPoints(o) : o.points)),
  );
  protected readonly adhesive = computed(() =>
    this.floor().adhesive.map((z) => polygonPath(rectPoints(z))),
  );
  protected readonly levelling = computed(() =>
    this.floor().levelling.map((z) => polygonPath(rectPoints(z))),
  );
  protected readonly doorways = computed(() => {
    const f = this.floor();
    return f.doorways.flatMap((d) => {
      const ends = doorwayEnds(f.outline, d);
      return ends
        ? [{ d: `M${ends[0][0]} ${ends[0][1]}L${ends[1][0]} ${ends[1][1]}`, ramp: d.ramp }]
        : [];
    });
  });

  private readonly fitted = computed(() => {
    const b = boundsOf(this.floor().outline);
    return fitView(b.minX, b.minY, b.maxX, b.maxY);
  });
  protected readonly view = signal<ViewBox>(this.fitted());
  protected readonly viewBox = computed(() => {
    const v = this.view();
    return `${v.x} ${v.y} ${v.w} ${v.h}`;
  });
  private readonly sizePx = signal<[number, number]>([0, 0]);
  /** Millimetres per CSS pixel: sizes of labels and handles stay constant on screen. */
  protected readonly px = computed(() => mmPerPixel(this.view(), ...this.sizePx()));
  protected readonly dimensions = computed(() =>
    wallDimensions(this.floor().outline, 14 * this.px()).map((w) => ({
      ...w,
      text: formatLength(w.lengthMm, this.floor().units),
    })),
  );
  protected readonly jointTransform = computed(() => {
    const p = this.plan();
    return p ? `translate(${p.origin.x} ${p.origin.y}) rotate(${p.angleDeg})` : '';
  });

  protected readonly picking = signal(false);
  protected readonly selected = signal<number | null>(null);
  protected readonly tip = signal<{ text: string; x: number; y: number } | null>(null);
  protected readonly selectedText = computed(() => {
    const k = this.selected();
    const cut = k === null ? undefined : this.cuts()[k];
    return cut ? this.cutText(cut.sizeMm, cut.sliver, k as number) : '';
  });
  protected readonly description = computed(() =>
    planDescription(this.floor(), this.result(), this.editor.stale()),
  );

  private drag: Drag = null;
  /** The outline last fitted to: a new shape refits, a dragged corner does not. */
  private fittedFor = '';

  constructor() {
    effect(() => {
      const f = this.floor();
      const key = `${f.source}:${f.outline.length}:${f.source === 'points' ? '' : JSON.stringify(f.outline)}`;
      if (key !== this.fittedFor && this.drag?.kind !== 'vertex') {
        this.fittedFor = key;
        untracked(() => this.fit());
      }
    });
    effect(() => {
      // A new takeoff renumbers the cut tiles.
      this.cuts();
      untracked(() => this.selected.set(null));
    });
    const host = inject(ElementRef).nativeElement as HTMLElement;
    if (typeof ResizeObserver !== 'undefined') {
      const watch = new ResizeObserver(([entry]) =>
        this.sizePx.set([entry.contentRect.width, entry.contentRect.height]),
      );
      watch.observe(host);
      inject(DestroyRef).onDestroy(() => watch.disconnect());
    }
  }

  protected fit(): void {
    this.view.set(this.fitted());
  }

  protected zoomBy(factor: number): void {
    const v = this.view();
    this.view.set(zoomView(v, factor, [v.x + v.w / 2, v.y + v.h / 2], this.fitted()));
  }

  protected togglePick(): void {
    this.picking.update((p) => !p);
  }

  protected onWheel(e: WheelEvent): void {
    e.preventDefault();
    const at = this.toScreen(e);
    this.view.set(zoomView(this.view(), Math.exp(-e.deltaY * 0.0015), at, this.fitted()));
  }

  protected onPointerDown(e: PointerEvent): void {
    if (e.button !== 0) return;
    const target = e.target as Element;
    const vertex = target.getAttribute('data-v');
    (e.currentTarget as Element).setPointerCapture?.(e.pointerId);
    this.drag =
      vertex !== null
        ? { kind: 'vertex', index: Number(vertex) }
        : { kind: 'pan', lastPx: [e.clientX, e.clientY], moved: false };
  }

  protected onPointerMove(e: PointerEvent): void {
    const drag = this.drag;
    if (!drag) return this.hoverCut(e);
    if (drag.kind === 'vertex') {
      const at = this.toScreen(e);
      const outline = this.floor().outline.slice();
      outline[drag.index] = [snap10(at[0]), snap10(-at[1])];
      this.editor.setOutline(outline, 'points');
      return;
    }
    const dx = e.clientX - drag.lastPx[0];
    const dy = e.clientY - drag.lastPx[1];
    if (Math.hypot(dx, dy) > 3) drag.moved = true;
    if (!drag.moved) return;
    const scale = this.scale();
    this.view.set(panView(this.view(), [dx * scale, dy * scale]));
    drag.lastPx = [e.clientX, e.clientY];
  }

  protected onPointerUp(e: PointerEvent): void {
    const drag = this.drag;
    this.drag = null;
    if (drag?.kind === 'pan' && !drag.moved && this.picking()) {
      const at = this.toScreen(e);
      this.editor.update((f) => ({
        ...f,
        origin: { mode: 'point', x: snap10(at[0]), y: snap10(-at[1]) },
      }));
      this.picking.set(false);
    }
  }

  protected onKey(e: KeyboardEvent): void {
    const n = this.cuts().length;
    const k = this.selected();
    if (e.key === '+' || e.key === '=') this.zoomBy(1.25);
    else if (e.key === '-' || e.key === '_') this.zoomBy(0.8);
    else if (e.key === '0') this.fit();
    else if ((e.key === 'ArrowRight' || e.key === 'ArrowLeft') && n > 0) {
      const step = e.key === 'ArrowRight' ? 1 : -1;
      this.selected.set(k === null ? (step > 0 ? 0 : n - 1) : (k + step + n) % n);
    } else if (e.key === 'Escape') this.selected.set(null);
    else return;
    e.preventDefault();
  }

  private hoverCut(e: PointerEvent): void {
    const k = (e.target as Element).getAttribute?.('data-k');
    const cut = k === null || k === undefined ? undefined : this.cuts()[Number(k)];
    if (!cut) return this.tip.set(null);
    const box = this.svg().nativeElement.getBoundingClientRect();
    this.tip.set({
      text: this.cutText(cut.sizeMm, cut.sliver, cut.k),
      x: e.clientX - box.left + 12,
      y: e.clientY - box.top + 12,
    });
  }

  private cutText(sizeMm: number, sliver: boolean, k: number): string {
    const size = formatLength(sizeMm, this.floor().units);
    return `Cut tile ${k + 1} of ${this.cuts().length}: ${size}${sliver ? ' — sliver, too thin to hold' : ''}`;
  }

  /** Millimetres per pixel of the SVG as it is laid out now. */
  private scale(): number {
    const box = this.svg().nativeElement.getBoundingClientRect();
    return mmPerPixel(this.view(), box.width, box.height);
  }

  /**
   * The pointer in the SVG's screen-mm coordinates (world y is its negative), from the view
   * signal rather than the rendered CTM, which lags a frame behind fast wheel and drag events.
   */
  private toScreen(e: MouseEvent): Point {
    const box = this.svg().nativeElement.getBoundingClientRect();
    const v = this.view();
    const scale = mmPerPixel(v, box.width, box.height);
    // preserveAspectRatio xMidYMid meet centres the view box in the element.
    const x0 = v.x - (box.width * scale - v.w) / 2;
    const y0 = v.y - (box.height * scale - v.h) / 2;
    return [x0 + (e.clientX - box.left) * scale, y0 + (e.clientY - box.top) * scale];
  }
}
