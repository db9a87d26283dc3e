/** Materials and labour from the measured quantities and the rates. */
import type { TakeoffRates } from '../rates';
import type { Labour, Materials } from '../types';

/** Rounds up, forgiving floating-point dust (3.0000000001 boxes is 3 boxes). */
export function ceilUnits(x: number): number {
  return Math.max(0, Math.ceil(x - 1e-9));
}

export interface MaterialInputs {
  skirtingMm: number;
  internalCorners: number;
  externalCorners: number;
  rampMm: number;
  rampPieces: number;
  adhesiveAreaM2: number;
  levelling: { areaM2: number; depthMm: number }[];
  anchorLengthMm: number;
}

export function materials(q: MaterialInputs, r: TakeoffRates): Materials {
  const adhesiveKg = q.adhesiveAreaM2 * r.adhesiveKgPerM2;
  // One mix covers what the crew lays before the pot life runs out, and no more than a kit.
  const m2PerPotLife = (r.adhesiveLayM2PerHourPerFitter * r.crewSize * r.adhesivePotLifeMin) / 60;
  const m2PerKit = r.adhesiveKgPerM2 > 0 ? r.adhesiveKitKg / r.adhesiveKgPerM2 : Infinity;
  const m2PerMix = Math.min(m2PerPotLife, m2PerKit);
  const levArea = q.levelling.reduce((s, z) => s + z.areaM2, 0);
  const fillerKg = q.levelling.reduce((s, z) => s + z.areaM2 * z.depthMm * r.fillerKgPerM2PerMm, 0);
  const primerL = levArea * r.primerLPerM2;
  const unitMm = r.anchoring === 'tape' ? r.tapeRollMm : r.masticCartridgeMm;
  return {
    skirting: {
      lengthMm: q.skirtingMm,
      pieces: ceilUnits((q.skirtingMm * (1 + r.skirtingWastePct / 100)) / r.skirtingStockMm),
      stockLengthMm: r.skirtingStockMm,
    },
    cornerTrims: { internal: q.internalCorners, external: q.externalCorners },
    ramps: { lengthMm: q.rampMm, pieces: q.rampPieces, stockLengthMm: r.rampStockMm },
    adhesive: {
      areaM2: q.adhesiveAreaM2,
      kg: adhesiveKg,
      kits: ceilUnits(adhesiveKg / r.adhesiveKitKg),
      mixes: q.adhesiveAreaM2 > 0 && m2PerMix > 0 ? ceilUnits(q.adhesiveAreaM2 / m2PerMix) : 0,
    },
    primer: { areaM2: levArea, litres: primerL, packs: ceilUnits(primerL / r.primerPackL) },
    filler: { areaM2: levArea, kg: fillerKg, bags: ceilUnits(fillerKg / r.fillerBagKg) },
    anchoring: {
      method: r.anchoring,
      lengthMm: q.anchorLengthMm,
      units: ceilUnits(q.anchorLengthMm / unitMm),
    },
  };
}

export interface LabourInputs {
  tiledAreaM2: number;
  cutTiles: number;
  adhesiveAreaM2: number;
  levellingAreaM2: number;
  skirtingMm: number;
  rampMm: number;
}

/** Person-hours per activity, and days for the crew. */
export function labour(q: LabourInputs, r: TakeoffRates): Labour {
  const laying = r.layM2PerHourPerFitter > 0 ? q.tiledAreaM2 / r.layM2PerHourPerFitter : 0;
  const cutting = (q.cutTiles * r.cutMinutesPerTile) / 60;
  // Laying into adhesive is slower: the extra over open-area laying, plus spreading it.
  const slowerLay =
    r.adhesiveLayM2PerHourPerFitter > 0 && r.layM2PerHourPerFitter > 0
      ? Math.max(
          0,
          q.adhesiveAreaM2 / r.adhesiveLayM2PerHourPerFitter -
            q.adhesiveAreaM2 / r.layM2PerHourPerFitter,
        )
      : 0;
  const adhesive = slowerLay + q.adhesiveAreaM2 * r.adhesiveHoursPerM2;
  const levelling = q.levellingAreaM2 * r.levellingHoursPerM2;
  const skirting = (q.skirtingMm + q.rampMm) / 1000 / r.skirtingMPerHour;
  const total = laying + cutting + adhesive + levelling + skirting;
  const crewDays = total / (r.crewSize * r.hoursPerDay);
  const round2 = (x: number) => Math.round(x * 100) / 100;
  return {
    hours: {
      laying: round2(laying),
      cutting: round2(cutting),
      adhesive: round2(adhesive),
      levelling: round2(levelling),
      skirting: round2(skirting),
      total: round2(total),
    },
    crewSize: r.crewSize,
    crewDays: round2(crewDays),
    crewDaysRoundedUp: ceilUnits(crewDays),
  };
}
