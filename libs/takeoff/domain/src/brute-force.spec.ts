/**
 * The outside reference the property tests compare the engine with: every grid cell clipped
 * against the tiled region with polygon-clipping (a general-purpose geometry library from
 * npm, used only in tests). The region is rebuilt here independently of the engine: mitred
 * offsets by intersecting the shifted edge lines, obstacles subtracted with polygon-clipping's
 * boolean difference.
 *
 * Not a test file itself: it is named `*.spec.ts` because that is the suffix the workspace
 * lint lets import test-only libraries, and vitest here collects `*.test.ts` only.
 */
import pc from 'polygon-clipping';
import type { Point } from './types';

export type Ring = Point[];

export const area = (r: Ring) =>
  r.reduce(
    (s, p, i) => s + (p[0] * r[(i + 1) % r.length][1] - r[(i + 1) % r.length][0] * p[1]),
    0,
  ) / 2;
const ccw = (r: Ring): Ring => (area(r) < 0 ? [...r].reverse() : [...r]);

/**
 * Drops repeated consecutive points: a zero-length edge has no direction to offset along,
 * and the ring is the same point set without it.
 */
function distinct(r: Ring): Ring {
  const out = r.filter((p, i) => {
    const q = r[(i + r.length - 1) % r.length];
    return p[0] !== q[0] || p[1] !== q[1];
  });
  return out.length ? out : [r[0]];
}

/** Mitred offset by intersecting the two shifted edge lines at each vertex (d > 0 outward of a CCW ring). */
export function mitreOffset(raw: Ring, d: number): Ring {
  const r = distinct(raw);
  const n = r.length;
  const shifted = r.map((a, i) => {
    const b = r[(i + 1) % n];
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
    const nx = (b[1] - a[1]) / len;
    const ny = -(b[0] - a[0]) / len;
    return { px: a[0] + d * nx, py: a[1] + d * ny, dx: b[0] - a[0], dy: b[1] - a[1] };
  });
  return r.map((v, i) => {
    const e1 = shifted[(i + n - 1) % n];
    const e2 = shifted[i];
    const det = e1.dx * -e2.dy - e1.dy * -e2.dx;
    if (Math.abs(det) < 1e-9 * Math.hypot(e1.dx, e1.dy) * Math.hypot(e2.dx, e2.dy))
      return [e2.px, e2.py];
    const t = ((e2.px - e1.px) * -e2.dy - (e2.py - e1.py) * -e2.dx) / det;
    return [e1.px + t * e1.dx, e1.py + t * e1.dy];
  });
}

export const mpArea = (mp: pc.MultiPolygon) =>
  mp.reduce(
    (s, poly) =>
      s + poly.reduce((t, ring, k) => t + (k === 0 ? 1 : -1) * Math.abs(area(ring as Ring)), 0),
    0,
  );

/**
 * Width (mm) under which a spike of a clipped ring is floating-point noise, not floor. The
 * noise of a mitred offset is a few ulps of the coordinates (about 1e-12 mm at 7 m); a real
 * wedge this thin would change a bounding box by less than the 1e-4 mm the checks allow.
 */
const SPIKE_MM = 1e-9;

/**
 * The ring without its zero-width spikes: vertices where the ring turns straight back (out
 * along a line and back along it) leaving a strip thinner than {@link SPIKE_MM}, and edges
 * shorter than that (the flat tip of such a spike).
 *
 * Why the reference needs this: where an obstacle's offset edge falls on the inner outline's
 * edge (a column set exactly one gap off a wall, so both offset edges are the same line), the
 * offsets computed here differ by an ulp (y = 5.000000000000057 against y = 5).
 * polygon-clipping is right for those coordinates and leaves a strip 6e-14 mm wide between
 * the two edges, which comes back as a spike of the neighbouring cell's piece running along
 * the wall. The definitions measure overlap by area: the strip has none and no tile piece
 * lies there, so it must not stretch the piece's bounding box (it did: a 136 mm notched cut
 * was reported as 245 mm; fast-check seed 299118673).
 */
export function withoutSpikes(closed: Ring): Ring {
  const r = closed.slice(0, -1); // polygon-clipping repeats the first point at the end
  for (let changed = true; changed && r.length > 3; ) {
    changed = false;
    for (let i = 0; i < r.length && r.length > 3; i++) {
      const a = r[(i + r.length - 1) % r.length];
      const v = r[i];
      const b = r[(i + 1) % r.length];
      const ux = v[0] - a[0];
      const uy = v[1] - a[1];
      const wx = b[0] - v[0];
      const wy = b[1] - v[1];
      const back = ux * wx + uy * wy < 0;
      const width = Math.abs(ux * wy - uy * wx) / Math.max(Math.hypot(ux, uy), Math.hypot(wx, wy));
      // A hair-long edge goes too: a spike's tip may be one (out, a hair across, back).
      if (Math.hypot(ux, uy) < SPIKE_MM || (back && !(width >= SPIKE_MM))) {
        r.splice(i, 1);
        changed = true;
        i--;
      }
    }
  }
  return r;
}

/** Size of a cut cell: its thinnest piece; specks under 1 mm² count only if all are specks. */
function pieceSize(inter: pc.MultiPolygon): number {
  const pieces = inter.map((poly) => {
    const outer = withoutSpikes(poly[0] as Ring);
    const pxs = outer.map((p) => p[0]);
    const pys = outer.map((p) => p[1]);
    const w = Math.max(...pxs) - Math.min(...pxs);
    const h = Math.max(...pys) - Math.min(...pys);
    return { a: mpArea([poly]), size: Math.min(w, h) };
  });
  const real = pieces.filter((p) => p.a >= 1);
  return real.length
    ? Math.min(...real.map((p) => p.size))
    : pieces.sort((u, v) => v.a - u.a)[0].size;
}

export type CellClass = 'full' | 'cut' | 'none';

/** What the brute force says about one grid cell near or above the 1 mm² threshold. */
export interface RefCell {
  cls: CellClass;
  /** Set when the overlap is within 1e-4 mm² of a threshold: this answer is fine too. */
  alt?: CellClass;
  /** Sizes a cut is allowed to report (see {@link HAIR_MM}). */
  sizes: number[];
}

export interface Reference {
  /** Area of the tiled region, mm². */
  area: number;
  cells: Map<string, RefCell>;
}

/**
 * How far (mm) a grid line may move without changing what we ask of a cut's size. The
 * definition (shorter side of the piece's bounding box) jumps where a grid line passes within
 * a hair of a region edge: a grid line 4e-9 mm below a wall's offset edge leaves a strip
 * 4e-9 mm high across the cell, which stretches the bounding box of the piece it is attached
 * to (84 mm wide becomes 234 mm; fast-check seed 1 at 5,000 runs). Which side of the hair a
 * computation lands on is float noise, so a cut may report the size of its cell as given or
 * of the cell pulled in by this hair on every side, where such strips are gone.
 */
const HAIR_MM = 1e-6;

/** Brute force: clip every tile of the grid against the region. */
export function bruteForce(
  outline: Ring,
  obstacles: Ring[],
  gap: number,
  pitch: number,
  ox: number,
  oy: number,
): Reference {
  const o = mitreOffset(ccw(outline), -gap);
  const holes = obstacles.map((h) => mitreOffset(ccw(h), gap));
  const region = (
    holes.length ? pc.difference([o], ...holes.map((h) => [h])) : [[o]]
  ) as pc.MultiPolygon;
  const res: Reference = { area: mpArea(region), cells: new Map() };
  const xs = o.map((p) => p[0]);
  const ys = o.map((p) => p[1]);
  const i0 = Math.floor((Math.min(...xs) - ox) / pitch) - 1;
  const i1 = Math.floor((Math.max(...xs) - ox) / pitch) + 1;
  const j0 = Math.floor((Math.min(...ys) - oy) / pitch) - 1;
  const j1 = Math.floor((Math.max(...ys) - oy) / pitch) + 1;
  const full = pitch * pitch - 1;
  const near = (a: number, t: number) => Math.abs(a - t) < 1e-4;
  const box = (x0: number, y0: number, x1: number, y1: number): pc.Polygon => [
    [
      [x0, y0],
      [x1, y0],
      [x1, y1],
      [x0, y1],
    ],
  ];
  for (let j = j0; j <= j1; j++) {
    for (let i = i0; i <= i1; i++) {
      const x0 = ox + i * pitch;
      const y0 = oy + j * pitch;
      const inter = pc.intersection(box(x0, y0, x0 + pitch, y0 + pitch), region);
      const a = mpArea(inter);
      if (a <= 1 && !near(a, 1)) continue;
      const cls: CellClass = a >= full ? 'full' : a > 1 ? 'cut' : 'none';
      let alt: CellClass | undefined;
      if (near(a, full)) alt = cls === 'full' ? 'cut' : 'full';
      else if (near(a, 1)) alt = cls === 'cut' ? 'none' : 'cut';
      const sizes = [pieceSize(inter)];
      if (cls === 'cut' || alt === 'cut') {
        const h = HAIR_MM;
        const inner = pc.intersection(box(x0 + h, y0 + h, x0 + pitch - h, y0 + pitch - h), region);
        if (inner.length) sizes.push(pieceSize(inner));
      }
      res.cells.set(`${i},${j}`, { cls, alt, sizes });
    }
  }
  return res;
}

/** polygon-clipping 0.15 now and then gives up on a near-degenerate ring; the caller skips those floors. */
export function attempt<T>(f: () => T): T | null {
  try {
    return f();
  } catch (e) {
    if (
      e instanceof Error &&
      /Unable to (complete output ring|find segment)|SweepLine|infinite loop/i.test(e.message)
    )
      return null;
    throw e;
  }
}
