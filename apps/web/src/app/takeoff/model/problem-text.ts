/**
 * The engine's validation problems as sentences for the page: which field (in the page's
 * words), which point, and the section of the form that shows it inline.
 */
import type { Point, TakeoffProblem } from '@latchwork/takeoff';
import { type Units, formatLength } from './lengths';

export type Section = 'outline' | 'obstacles' | 'doorways' | 'zones' | 'layout' | 'rates';

export interface ShownProblem {
  section: Section;
  text: string;
  /** Where to mark it on the plan, mm. */
  point?: Point;
}

const NAMES: ReadonlyArray<readonly [RegExp, Section, (n: number) => string]> = [
  [/^obstacles\[(\d+)\]/, 'obstacles', (n) => `Obstacle ${n}`],
  [/^doorways\[(\d+)\]/, 'doorways', (n) => `Doorway ${n}`],
  [/^zones\.adhesive\[(\d+)\]/, 'zones', (n) => `Adhesive zone ${n}`],
  [/^zones\.levelling\[(\d+)\]/, 'zones', (n) => `Levelling zone ${n}`],
  [/^pattern\.bays\[(\d+)\]/, 'layout', (n) => `Bay ${n}`],
];

const SCALARS: Readonly<Record<string, readonly [Section, string]>> = {
  'tile.pitchMm': ['layout', 'Tile pitch'],
  gapMm: ['layout', 'Gap'],
  origin: ['layout', 'Origin'],
  pattern: ['layout', 'Pattern'],
  outline: ['outline', 'Outline'],
};

/** The 1-based number of the outline point the problem is about, or null. */
export function outlinePointNumber(outline: Point[], problem: TakeoffProblem): number | null {
  const at = /^outline\[(\d+)\]/.exec(problem.field);
  if (at) return Number(at[1]) + 1;
  const p = problem.point;
  if (!p || outline.length === 0) return null;
  const n = outline.length;
  const vertex = outline.findIndex((q) => Math.hypot(q[0] - p[0], q[1] - p[1]) < 1e-6);
  if (vertex >= 0 && !/crosses/.test(problem.message)) return vertex + 1;
  // A crossing lies on two walls: name the later-typed corner of those walls, the one whose
  // entry made the walls cross.
  let latest = -1;
  for (let a = 0; a < n; a++) {
    const q = outline[a];
    const r = outline[(a + 1) % n];
    if (distanceToSegment(p, q, r) <= 1e-6 * Math.max(1, Math.abs(p[0]), Math.abs(p[1])))
      latest = Math.max(latest, a, (a + 1) % n);
  }
  return latest >= 0 ? latest + 1 : vertex >= 0 ? vertex + 1 : null;
}

function distanceToSegment(p: Point, a: Point, b: Point): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  const t =
    len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2));
  return Math.hypot(p[0] - (a[0] + t * dx), p[1] - (a[1] + t * dy));
}

/** One problem as the page shows it. */
export function showProblem(problem: TakeoffProblem, outline: Point[], units: Units): ShownProblem {
  const where = problem.point
    ? ` (at ${formatLength(problem.point[0], units)}, ${formatLength(problem.point[1], units)})`
    : '';
  const base = { point: problem.point };
  if (problem.field === 'outline' || problem.field.startsWith('outline[')) {
    // Only a crossing or a bad point belongs to one corner; "too few points" is the whole outline.
    const crossing = /crosses or touches itself/.test(problem.message);
    const k = crossing || problem.field !== 'outline' ? outlinePointNumber(outline, problem) : null;
    if (k !== null && crossing)
      return {
        ...base,
        section: 'outline',
        text: `Outline point ${k} makes the walls cross${where}`,
      };
    const label = k === null ? 'Outline' : `Outline point ${k}`;
    return { ...base, section: 'outline', text: `${label}: ${problem.message}${where}` };
  }
  for (const [re, section, name] of NAMES) {
    const m = re.exec(problem.field);
    if (m) {
      const rest = problem.field.slice(m[0].length).replace(/^\./, '');
      const detail = rest === 'depthMm' ? ' depth' : '';
      return {
        ...base,
        section,
        text: `${name(Number(m[1]) + 1)}${detail} ${problem.message}${where}`,
      };
    }
  }
  if (problem.field.startsWith('rates.'))
    return {
      ...base,
      section: 'rates',
      text: `Firm rate ${problem.field.slice(6)}: ${problem.message}`,
    };
  const scalar = SCALARS[problem.field] ?? SCALARS[problem.field.split('.')[0]];
  const [section, label] = scalar ?? ['layout', problem.field || 'Floor'];
  return { ...base, section, text: `${label} ${problem.message}${where}` };
}
