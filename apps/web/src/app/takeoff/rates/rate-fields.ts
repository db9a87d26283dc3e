import type { TakeoffRates } from '@latchwork/takeoff';

/** A numeric rate as the Firm rates panel shows it. */
export interface RateField {
  readonly key: Exclude<keyof TakeoffRates, 'anchoring'>;
  readonly label: string;
  readonly unit: string;
  /** Whole numbers only (tile counts, people). */
  readonly whole?: boolean;
}

/** Every numeric rate of the engine, grouped as an estimator thinks of them. */
export const RATE_GROUPS: readonly { title: string; fields: readonly RateField[] }[] = [
  {
    title: 'Tiles',
    fields: [
      { key: 'overagePct', label: 'Overage', unit: '%' },
      { key: 'packSize', label: 'Tiles per box', unit: 'tiles', whole: true },
      { key: 'gapMm', label: 'Gap at walls', unit: 'mm' },
      { key: 'productionBatchM2', label: 'One production batch covers', unit: 'm²' },
    ],
  },
  {
    title: 'Adhesive, primer, filler',
    fields: [
      { key: 'adhesiveKgPerM2', label: 'Adhesive coverage', unit: 'kg/m²' },
      { key: 'adhesiveKitKg', label: 'Adhesive kit', unit: 'kg' },
      { key: 'adhesivePotLifeMin', label: 'Adhesive pot life', unit: 'min' },
      {
        key: 'adhesiveLayM2PerHourPerFitter',
        label: 'Laying into adhesive',
        unit: 'm²/h per fitter',
      },
      { key: 'primerLPerM2', label: 'Primer', unit: 'L/m²' },
      { key: 'primerPackL', label: 'Primer pack', unit: 'L' },
      { key: 'fillerKgPerM2PerMm', label: 'Filler', unit: 'kg/m² per mm' },
      { key: 'fillerBagKg', label: 'Filler bag', unit: 'kg' },
    ],
  },
  {
    title: 'Edges',
    fields: [
      { key: 'tapeRollMm', label: 'Tape roll', unit: 'mm' },
      { key: 'masticCartridgeMm', label: 'Mastic cartridge runs', unit: 'mm' },
      { key: 'skirtingStockMm', label: 'Skirting stock length', unit: 'mm' },
      { key: 'skirtingWastePct', label: 'Skirting waste', unit: '%' },
      { key: 'rampStockMm', label: 'Edge ramp stock length', unit: 'mm' },
      { key: 'cornerMinTurnDeg', label: 'Straight join below', unit: '°' },
    ],
  },
  {
    title: 'Labour',
    fields: [
      { key: 'layM2PerHourPerFitter', label: 'Laying, open area', unit: 'm²/h per fitter' },
      { key: 'cutMinutesPerTile', label: 'Cutting', unit: 'min per cut tile' },
      { key: 'adhesiveHoursPerM2', label: 'Spreading adhesive', unit: 'h/m²' },
      { key: 'levellingHoursPerM2', label: 'Priming and levelling', unit: 'h/m²' },
      { key: 'skirtingMPerHour', label: 'Skirting and trims', unit: 'm/h' },
      { key: 'crewSize', label: 'Crew', unit: 'fitters', whole: true },
      { key: 'hoursPerDay', label: 'Working day', unit: 'h' },
    ],
  },
  {
    title: 'Acclimatisation',
    fields: [
      { key: 'acclimatiseHours', label: 'Tiles lie in the room', unit: 'h' },
      { key: 'minRoomTempC', label: 'Warm the room to at least', unit: '°C' },
    ],
  },
];
