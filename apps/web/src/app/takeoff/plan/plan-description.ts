import type { TakeoffResult } from '@latchwork/takeoff';
import type { FloorDraft } from '../model/floor-draft';
import { formatLength } from '../model/lengths';
import { boundsOf } from './plan-drawing';

/**
 * The plan in words, for screen readers (the SVG's description): the floor's size and features,
 * how the tiles fall and where the grid starts. The bill beside it carries the figures.
 */
export function planDescription(
  floor: FloorDraft,
  result: TakeoffResult | null,
  stale: boolean,
): string {
  const u = floor.units;
  const b = boundsOf(floor.outline);
  const parts = [
    `Floor outline with ${floor.outline.length} walls, ${formatLength(b.maxX - b.minX, u)} by ${formatLength(b.maxY - b.minY, u)} overall`,
  ];
  const features = [
    [floor.obstacles.length, 'obstacle'],
    [floor.doorways.length, 'doorway'],
    [floor.adhesive.length, 'adhesive zone'],
    [floor.levelling.length, 'levelling zone'],
  ] as const;
  const listed = features
    .filter(([n]) => n > 0)
    .map(([n, what]) => `${n} ${what}${n > 1 ? 's' : ''}`);
  if (listed.length) parts.push(listed.join(', '));
  if (!result) return `${parts.join('; ')}. No layout yet.`;
  const t = result.tiles;
  const smallest = result.cuts.smallestMm;
  parts.push(
    `${t.full + t.cut} tiles laid: ${t.full} full and ${t.cut} cut` +
      (smallest === null ? '' : `, the thinnest cut ${formatLength(smallest, u)}`) +
      (result.cuts.slivers ? `, ${result.cuts.slivers} slivers` : ', no slivers'),
  );
  parts.push(
    `grid origin at ${formatLength(result.origin.x, u)}, ${formatLength(result.origin.y, u)}`,
  );
  const text = `${parts.join('; ')}.`;
  return stale ? `${text} This layout is out of date: the floor as entered has problems.` : text;
}
