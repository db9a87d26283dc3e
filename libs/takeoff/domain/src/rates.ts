/**
 * Default rates of the takeoff. Tenants edit them in settings; a takeoff may override any
 * of them through `input.rates`. Each default names where it comes from: "common practice"
 * (what the trade generally works to) or "from memory" (a plausible figure picked by the
 * engine's author — check it against your supplier's data sheet before relying on it).
 */
export interface TakeoffRates {
  /** Extra tiles ordered on top of the pieces needed, percent. */
  overagePct: number;
  /** Tiles per box. */
  packSize: number;
  /** Default expansion gap at walls and obstacles, mm. */
  gapMm: number;

  /** Adhesive coverage, kg per m² of adhesive zone. */
  adhesiveKgPerM2: number;
  /** Adhesive kit (both parts) mass, kg. */
  adhesiveKitKg: number;
  /** Workable time of a mixed two-part adhesive, minutes. */
  adhesivePotLifeMin: number;
  /** Area one fitter lays in adhesive per hour, m²/h. */
  adhesiveLayM2PerHourPerFitter: number;

  /** Primer, litres per m² of levelling zone. */
  primerLPerM2: number;
  /** Primer container, litres. */
  primerPackL: number;
  /** Levelling filler, kg per m² per mm of depth. */
  fillerKgPerM2PerMm: number;
  /** Filler bag, kg. */
  fillerBagKg: number;

  /** How loose-laid edges are anchored along the perimeter. */
  anchoring: 'tape' | 'mastic';
  /** Length of one roll of double-sided tape, mm. */
  tapeRollMm: number;
  /** Length of bead one mastic cartridge runs, mm. */
  masticCartridgeMm: number;

  /** Skirting stock length, mm. */
  skirtingStockMm: number;
  /** Skirting waste allowance for joints and mitres, percent. */
  skirtingWastePct: number;
  /** Edge ramp stock length, mm. */
  rampStockMm: number;
  /** A vertex turning less than this is treated as straight (no corner trim), degrees. */
  cornerMinTurnDeg: number;

  /** Open-area laying of full tiles, m² per hour per fitter. */
  layM2PerHourPerFitter: number;
  /** Time to measure, cut and fit one cut tile, minutes. */
  cutMinutesPerTile: number;
  /** Extra time for spreading adhesive, hours per m² (crew total). */
  adhesiveHoursPerM2: number;
  /** Priming and levelling, hours per m² (crew total). */
  levellingHoursPerM2: number;
  /** Skirting, ramps and trims, metres fitted per hour. */
  skirtingMPerHour: number;
  /** Fitters in the crew. */
  crewSize: number;
  /** Working hours in a crew day. */
  hoursPerDay: number;

  /** Floor area one production batch of one colour usually covers, m². */
  productionBatchM2: number;
  /** Hours tiles must lie in the room before fitting. */
  acclimatiseHours: number;
  /** The room must be warmed to at least this, °C. */
  minRoomTempC: number;
}

export const DEFAULT_RATES: Readonly<TakeoffRates> = Object.freeze({
  overagePct: 5, // from memory: 5 % covers breakage and mis-cuts on a tile floor
  packSize: 10, // from memory: interlocking tiles commonly ship 10 to a box; set per product
  gapMm: 5, // common practice: 5 mm expansion gap at walls for interlocking PVC tiles

  adhesiveKgPerM2: 0.4, // from memory: two-part PU adhesive under tiles, notched trowel
  adhesiveKitKg: 6, // from memory: a common two-part kit size
  adhesivePotLifeMin: 20, // common practice: a two-part adhesive is workable about 20 minutes
  adhesiveLayM2PerHourPerFitter: 8, // from memory: laying into wet adhesive is slower than loose-lay

  primerLPerM2: 0.15, // from memory: one coat of primer on a concrete slab
  primerPackL: 5, // from memory
  fillerKgPerM2PerMm: 1.6, // from memory: self-levelling compound, about 1.5–1.7 kg/m²/mm
  fillerBagKg: 25, // common practice: filler comes in 25 kg bags

  anchoring: 'tape', // common practice: double-sided tape along the walls holds loose-laid edges
  tapeRollMm: 25_000, // from memory: 25 m rolls
  masticCartridgeMm: 12_000, // from memory: a 310 ml cartridge runs about 12 m of bead

  skirtingStockMm: 2_500, // from memory: skirting sold in 2.5 m lengths
  skirtingWastePct: 10, // from memory: joints and mitres
  rampStockMm: 500, // from memory: edge ramps for 500 mm interlocking tiles come tile-length
  cornerMinTurnDeg: 0.5, // from memory: below this a vertex is a straight join (curves as polylines)

  layM2PerHourPerFitter: 20, // from memory: loose-lay interlocking tiles in open area
  cutMinutesPerTile: 3, // from memory: measure, mark, guillotine and fit one cut tile
  adhesiveHoursPerM2: 0.05, // from memory: spreading adhesive, on top of laying
  levellingHoursPerM2: 0.1, // from memory: prime, mix and pour filler
  skirtingMPerHour: 12, // from memory
  crewSize: 2, // from memory: a typical two-fitter crew
  hoursPerDay: 8, // common practice: an eight-hour working day

  productionBatchM2: 1_000, // from memory: one batch of one colour; shades differ between batches
  acclimatiseHours: 24, // common practice: tiles lie in the room 24 h before fitting
  minRoomTempC: 15, // common practice: warm a cold room to at least 15 °C
});

/** The defaults with the given overrides applied (undefined values keep the default). */
export function resolveRates(overrides?: Partial<TakeoffRates>): TakeoffRates {
  const rates: TakeoffRates = { ...DEFAULT_RATES };
  if (overrides) {
    for (const key of Object.keys(overrides) as (keyof TakeoffRates)[]) {
      const value = overrides[key];
      if (value !== undefined) (rates as unknown as Record<string, unknown>)[key] = value;
    }
  }
  return rates;
}
