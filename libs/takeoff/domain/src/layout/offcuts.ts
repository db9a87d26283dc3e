/**
 * Offcut reuse. A straight cut splits a tile in two across the whole tile. If the kept part
 * is the tile's left part (placed at a right-hand wall, joining the field on its left), the
 * offcut is the right part, whose connectors face the field when it is laid at a left-hand
 * wall of the same row — where a right part is needed. So a left part of width a and a
 * right part of width b in the same row (and colour) come from one tile when a + b ≤ pitch;
 * likewise bottom and top parts in the same column. Each such pair saves one tile.
 *
 * Pairing per row is a threshold matching; the greedy below (smallest of one side against
 * the largest of the other that still fits) finds the maximum number of pairs.
 */
import type { CutKind } from '../types';

export interface OffcutCandidate {
  i: number;
  j: number;
  kind: CutKind;
  keptMm: number;
  colour: number;
}

/**
 * Returns the indices (into `cells`) of the cut tiles that are filled from an offcut; its
 * length is the number of tiles saved.
 */
export function pairOffcuts(cells: readonly OffcutCandidate[], pitch: number): number[] {
  const groups = new Map<string, { a: number[]; b: number[] }>();
  cells.forEach((c, idx) => {
    let key: string;
    let sideA: boolean;
    switch (c.kind) {
      case 'left-part':
      case 'right-part':
        key = `r${c.j}:${c.colour}`;
        sideA = c.kind === 'left-part';
        break;
      case 'bottom-part':
      case 'top-part':
        key = `c${c.i}:${c.colour}`;
        sideA = c.kind === 'bottom-part';
        break;
      default:
        return;
    }
    let g = groups.get(key);
    if (!g) groups.set(key, (g = { a: [], b: [] }));
    (sideA ? g.a : g.b).push(idx);
  });
  const filled: number[] = [];
  const tol = 1e-6;
  for (const { a, b } of groups.values()) {
    if (a.length === 0 || b.length === 0) continue;
    a.sort((x, y) => cells[x].keptMm - cells[y].keptMm);
    b.sort((x, y) => cells[y].keptMm - cells[x].keptMm);
    let ia = 0;
    for (let ib = 0; ib < b.length && ia < a.length; ib++) {
      if (cells[a[ia]].keptMm + cells[b[ib]].keptMm <= pitch + tol) {
        // The smaller piece of the pair is the one cut from the other's offcut.
        filled.push(cells[a[ia]].keptMm <= cells[b[ib]].keptMm ? a[ia] : b[ib]);
        ia++;
      }
    }
  }
  return filled;
}
