/**
 * Keeps the floor being edited in localStorage, per firm, so a reload loses nothing. What comes
 * back is checked loosely (shape, not sense: the engine's validator judges the sense) and
 * anything unreadable is dropped in favour of the example floor.
 */
import type { FloorDraft } from './floor-draft';

const KEY_PREFIX = 'latchwork.takeoff.floor.v1';

export function storageKey(tenantId: string | null): string {
  return `${KEY_PREFIX}:${tenantId ?? 'none'}`;
}

const isObj = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v);
const isPointList = (v: unknown): boolean =>
  Array.isArray(v) &&
  v.every((p) => Array.isArray(p) && p.length === 2 && p.every((c) => typeof c === 'number'));

/** The stored floor, or null when there is none or it does not look like a floor. */
export function loadFloor(storage: Storage, key: string): FloorDraft | null {
  let parsed: unknown;
  try {
    const raw = storage.getItem(key);
    if (raw === null) return null;
    parsed = JSON.parse(raw);
  } catch {
    return null;
  }
  if (!isObj(parsed)) return null;
  const ok =
    typeof parsed['name'] === 'string' &&
    (parsed['units'] === 'metric' || parsed['units'] === 'imperial') &&
    isPointList(parsed['outline']) &&
    isObj(parsed['walk']) &&
    ['obstacles', 'doorways', 'adhesive', 'levelling'].every((k) => Array.isArray(parsed[k])) &&
    typeof parsed['pitchMm'] === 'number' &&
    typeof parsed['gapMm'] === 'number' &&
    isObj(parsed['origin']) &&
    isObj(parsed['pattern']);
  return ok ? (parsed as unknown as FloorDraft) : null;
}

/** Saves the floor; a full or blocked storage only costs the reload safety, never the page. */
export function saveFloor(storage: Storage, key: string, floor: FloorDraft): void {
  try {
    storage.setItem(key, JSON.stringify(floor));
  } catch {
    // Quota or privacy mode: the floor stays in memory.
  }
}
