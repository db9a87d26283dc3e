/**
 * Colour of each tile from the pattern. Chequer and stripes count from the grid's origin
 * cell (0, 0). Border and bays are decided by the tile's centre: a border tile's centre lies
 * within rows × pitch of the tiled region's outer edge; a bay tile's centre lies inside the
 * bay (later bays win where bays overlap). Row-by-row interval lists keep this linear.
 */
import { rotatePoints } from '../geometry/polygon';
import type { Pattern, Point } from '../types';

export interface Colourer {
  colours: string[];
  /** Prepare row j (call before colourAt for that row). */
  beginRow(j: number): void;
  colourAt(i: number, j: number): number;
  /** True when every tile has colour 0. */
  uniform: boolean;
}

export const DEFAULT_COLOUR = 'default';

export function makeColourer(
  pattern: Pattern | undefined,
  grid: { ox: number; oy: number; pitch: number; angleDeg: number },
  regionOutline: Point[],
): Colourer {
  const { ox, oy, pitch: p } = grid;
  const pat: Pattern = pattern ?? { kind: 'single' };
  const none = () => undefined;
  switch (pat.kind) {
    case 'single':
      return {
        colours: [pat.colour ?? DEFAULT_COLOUR],
        beginRow: none,
        colourAt: () => 0,
        uniform: true,
      };
    case 'chequer':
      return {
        colours: [pat.colours[0], pat.colours[1]],
        beginRow: none,
        colourAt: (i, j) => (((i + j) % 2) + 2) % 2,
        uniform: false,
      };
    case 'stripes': {
      const w = pat.widthTiles ?? 1;
      const n = pat.colours.length;
      const byRows = (pat.direction ?? 'rows') === 'rows';
      return {
        colours: [...pat.colours],
        beginRow: none,
        colourAt: (i, j) => ((Math.floor((byRows ? j : i) / w) % n) + n) % n,
        uniform: n === 1,
      };
    }
    case 'border':
      return borderColourer(
        pat.rows * p,
        pat.borderColour,
        pat.fieldColour,
        ox,
        oy,
        p,
        regionOutline,
      );
    case 'bays': {
      const bays = pat.bays.map((b) => rotatePoints(b.polygon, -grid.angleDeg));
      const colours = [pat.baseColour, ...pat.bays.map((b) => b.colour)];
      let rowIntervals: number[][] = [];
      return {
        colours,
        uniform: bays.length === 0,
        beginRow(j) {
          const yc = oy + (j + 0.5) * p;
          rowIntervals = bays.map((ring) => scanline(ring, yc));
        },
        colourAt(i) {
          const xc = ox + (i + 0.5) * p;
          for (let b = rowIntervals.length - 1; b >= 0; b--)
            if (inIntervals(rowIntervals[b], xc)) return b + 1;
          return 0;
        },
      };
    }
  }
}

/** Even-odd crossings of a ring with the line y = yc, as sorted [x0, x1, x2, x3, …] pairs. */
function scanline(ring: Point[], yc: number): number[] {
  const xs: number[] = [];
  for (let a = 0, b = ring.length - 1; a < ring.length; b = a++) {
    const [xa, ya] = ring[a];
    const [xb, yb] = ring[b];
    if (ya > yc !== yb > yc) xs.push(xa + ((yc - ya) * (xb - xa)) / (yb - ya));
  }
  return xs.sort((u, v) => u - v);
}

function inIntervals(iv: number[], x: number): boolean {
  for (let k = 0; k + 1 < iv.length; k += 2) if (x >= iv[k] && x <= iv[k + 1]) return true;
  return false;
}

function borderColourer(
  band: number,
  borderColour: string,
  fieldColour: string,
  ox: number,
  oy: number,
  p: number,
  ring: Point[],
): Colourer {
  // Bucket the edges by the rows whose centre line comes within `band` of them.
  const byRow = new Map<number, number[]>();
  for (let a = 0; a < ring.length; a++) {
    const b = (a + 1) % ring.length;
    const lo = Math.min(ring[a][1], ring[b][1]) - band;
    const hi = Math.max(ring[a][1], ring[b][1]) + band;
    for (let j = Math.ceil((lo - oy) / p - 0.5); j <= Math.floor((hi - oy) / p - 0.5); j++) {
      let list = byRow.get(j);
      if (!list) byRow.set(j, (list = []));
      list.push(a);
    }
  }
  let intervals: number[] = [];
  return {
    colours: [fieldColour, borderColour],
    uniform: false,
    beginRow(j) {
      const yc = oy + (j + 0.5) * p;
      const raw: [number, number][] = [];
      for (const a of byRow.get(j) ?? []) {
        const iv = capsuleOnLine(ring[a], ring[(a + 1) % ring.length], band, yc);
        if (iv) raw.push(iv);
      }
      raw.sort((u, v) => u[0] - v[0]);
      intervals = [];
      for (const [s, e] of raw) {
        const n = intervals.length;
        if (n && s <= intervals[n - 1]) intervals[n - 1] = Math.max(intervals[n - 1], e);
        else intervals.push(s, e);
      }
    },
    colourAt(i) {
      const xc = ox + (i + 0.5) * p;
      // Strictly within the band: a centre exactly N pitches from the wall is field.
      for (let k = 0; k + 1 < intervals.length; k += 2)
        if (xc > intervals[k] && xc < intervals[k + 1]) return 1;
      return 0;
    },
  };
}

/** The x-interval of the line y = yc within distance r of segment ab (a capsule), or null. */
function capsuleOnLine(a: Point, b: Point, r: number, yc: number): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  for (const q of [a, b]) {
    const dy = yc - q[1];
    if (Math.abs(dy) < r) {
      const dx = Math.sqrt(r * r - dy * dy);
      lo = Math.min(lo, q[0] - dx);
      hi = Math.max(hi, q[0] + dx);
    }
  }
  // Band part: 0 ≤ (P − a)·u ≤ L and |(P − a)·n| < r, linear in x for P = (x, yc).
  const L = Math.hypot(b[0] - a[0], b[1] - a[1]);
  const ux = (b[0] - a[0]) / L;
  const uy = (b[1] - a[1]) / L;
  let s = -Infinity;
  let e = Infinity;
  const clip = (coef: number, base: number, min: number, max: number) => {
    // min ≤ coef·x + base ≤ max
    if (Math.abs(coef) < 1e-12) {
      if (base < min || base > max) e = -Infinity;
      return;
    }
    const x1 = (min - base) / coef;
    const x2 = (max - base) / coef;
    s = Math.max(s, Math.min(x1, x2));
    e = Math.min(e, Math.max(x1, x2));
  };
  clip(ux, (0 - a[0]) * ux + (yc - a[1]) * uy, 0, L);
  clip(-uy, (0 - a[0]) * -uy + (yc - a[1]) * ux, -r, r);
  if (e > s) {
    lo = Math.min(lo, s);
    hi = Math.max(hi, e);
  }
  return hi > lo ? [lo, hi] : null;
}
