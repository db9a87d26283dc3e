/**
 * A job's estimated materials from its saved takeoffs, in the catalogue's terms: what kind
 * of product (and, for tiles, which colour) and how many stock units. The takeoff counts
 * tiles per colour, skirting, ramp and trim pieces, adhesive kits, primer packs, filler bags
 * and tape or mastic units; the catalogue's products of those kinds are stocked in the same
 * units (a tile, a stock length, a kit, a pack, a bag), so the numbers compare directly.
 */

/** The part of a saved takeoff summary this reads (the takeoff library's result shape). */
export interface TakeoffMaterialsSummary {
  tiles?: { byColour?: { colour: string; toOrder: number }[] };
  materials?: {
    skirting?: { pieces: number };
    cornerTrims?: { internal: number; external: number };
    ramps?: { pieces: number };
    adhesive?: { kits: number };
    primer?: { packs: number };
    filler?: { bags: number };
    anchoring?: { method: 'tape' | 'mastic'; units: number };
  };
}

/** One estimated material line: a product kind, a colour for tiles, a quantity. */
export interface EstimateLine {
  kind: string;
  colour: string | null;
  quantity: number;
}

/** Key of an estimate line, also used to group what was issued: `tile|Graphite`, `adhesive|`. */
export const materialKey = (kind: string, colour: string | null): string =>
  `${kind}|${kind === 'tile' ? (colour ?? '').trim().toLowerCase() : ''}`;

/** Sums the materials of several takeoffs (one per area) into lines by kind and colour. */
export function estimateFromTakeoffs(
  summaries: readonly TakeoffMaterialsSummary[],
): EstimateLine[] {
  const lines = new Map<string, EstimateLine>();
  const add = (kind: string, colour: string | null, quantity: number | undefined) => {
    if (!quantity || quantity <= 0) return;
    const key = materialKey(kind, colour);
    const line = lines.get(key) ?? { kind, colour: kind === 'tile' ? colour : null, quantity: 0 };
    line.quantity += quantity;
    lines.set(key, line);
  };
  for (const s of summaries) {
    for (const c of s.tiles?.byColour ?? []) add('tile', c.colour, c.toOrder);
    const m = s.materials ?? {};
    add('skirting', null, m.skirting?.pieces);
    add('corner_trim', null, (m.cornerTrims?.internal ?? 0) + (m.cornerTrims?.external ?? 0));
    add('ramp', null, m.ramps?.pieces);
    add('adhesive', null, m.adhesive?.kits);
    add('primer', null, m.primer?.packs);
    add('filler', null, m.filler?.bags);
    if (m.anchoring) add(m.anchoring.method, null, m.anchoring.units);
  }
  return [...lines.values()];
}
