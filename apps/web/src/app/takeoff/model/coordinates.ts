/**
 * Coordinates typed or pasted one point a line, `x, y`: millimetres (or `6.5 m`) in metric,
 * feet and inches (`19' 8", 6'`) in imperial. Tabs or semicolons also separate x from y, so
 * two columns pasted from a spreadsheet work.
 */
import type { Point } from '@latchwork/takeoff';
import { type BareUnit, type Units, formatLengthInput, parseLength } from './lengths';

export interface ParsedCoordinates {
  points: Point[];
  /** One message per unreadable line, naming the line (1-based). */
  errors: { line: number; message: string }[];
}

/** Reads the points; blank lines and lines starting with `#` are skipped. */
export function parseCoordinates(
  text: string,
  units: Units,
  bare: BareUnit = units === 'metric' ? 'mm' : 'ft',
): ParsedCoordinates {
  const points: Point[] = [];
  const errors: ParsedCoordinates['errors'] = [];
  text.split(/\r?\n/).forEach((raw, k) => {
    const line = raw.trim();
    if (line === '' || line.startsWith('#')) return;
    const parts = splitPair(line);
    if (!parts) {
      errors.push({ line: k + 1, message: `Line ${k + 1}: write one point as "x, y"` });
      return;
    }
    const x = parseLength(parts[0], units, bare);
    const y = parseLength(parts[1], units, bare);
    if (x === null || y === null || !Number.isFinite(x) || !Number.isFinite(y)) {
      const bad = x === null || !Number.isFinite(x) ? parts[0] : parts[1];
      errors.push({
        line: k + 1,
        message: `Line ${k + 1}: cannot read "${bad.trim()}" as a length`,
      });
      return;
    }
    points.push([x, y]);
  });
  return { points, errors };
}

/** x and y of one line: split on a tab, semicolon or comma (the comma is never a decimal mark here). */
function splitPair(line: string): [string, string] | null {
  for (const sep of ['\t', ';', ',']) {
    const parts = line.split(sep);
    if (parts.length === 2 && parts[0].trim() && parts[1].trim()) return [parts[0], parts[1]];
  }
  // Two numbers separated by spaces only (metric), e.g. "1200 3400".
  const spaced = /^(\S+)\s+(\S+)$/.exec(line);
  return spaced && !/['"′″]/.test(line) ? [spaced[1], spaced[2]] : null;
}

/** The outline as text {@link parseCoordinates} reads back. */
export function formatCoordinates(points: Point[], units: Units): string {
  return points
    .map(([x, y]) => `${formatLengthInput(x, units)}, ${formatLengthInput(y, units)}`)
    .join('\n');
}
