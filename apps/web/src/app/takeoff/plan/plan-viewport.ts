/**
 * Pan and zoom of the plan as pure arithmetic on the SVG viewBox (screen coordinates: x right,
 * y down, in mm). The component feeds it pointer positions already mapped into those units.
 */
import type { Point } from '@latchwork/takeoff';

export interface ViewBox {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** Closest and farthest zoom relative to the fitted view. */
export const MIN_ZOOM = 0.2;
export const MAX_ZOOM = 200;

/** A view of the box around the floor with a margin for the wall dimensions. */
export function fitView(minX: number, minY: number, maxX: number, maxY: number): ViewBox {
  const w = Math.max(maxX - minX, 100);
  const h = Math.max(maxY - minY, 100);
  const margin = Math.max(w, h) * 0.1;
  // Screen y is world y flipped: the top of the screen box is the floor's largest y.
  return { x: minX - margin, y: -maxY - margin, w: w + 2 * margin, h: h + 2 * margin };
}

/** The view zoomed by `factor` (> 1 zooms in) about the screen point `at`, within limits. */
export function zoomView(view: ViewBox, factor: number, at: Point, fitted: ViewBox): ViewBox {
  const zoomNow = fitted.w / view.w;
  const target = Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, zoomNow * factor));
  const f = target / zoomNow;
  const w = view.w / f;
  const h = view.h / f;
  return {
    x: at[0] - (at[0] - view.x) / f,
    y: at[1] - (at[1] - view.y) / f,
    w,
    h,
  };
}

/** The view moved so that the content under the pointer follows it by `delta` screen mm. */
export function panView(view: ViewBox, delta: Point): ViewBox {
  return { ...view, x: view.x - delta[0], y: view.y - delta[1] };
}

/** Millimetres of floor per CSS pixel for a view shown in an element of the given size. */
export function mmPerPixel(view: ViewBox, widthPx: number, heightPx: number): number {
  if (widthPx <= 0 || heightPx <= 0) return view.w / 600;
  // preserveAspectRatio "meet": the tighter axis sets the scale.
  return Math.max(view.w / widthPx, view.h / heightPx);
}

/** A coordinate snapped to the 10 mm grid the plan's vertex handles move on. */
export function snap10(v: number): number {
  return Math.round(v / 10) * 10 + 0;
}
