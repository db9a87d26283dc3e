/**
 * The few figures of a takeoff an estimator scans in a list: area, tiles laid (the count to
 * check against the plan) and to order, the thinnest cut, labour. The full bill is in the floor editor.
 */
import type { TakeoffSummary } from '../survey-api';

export interface KeyFigure {
  readonly label: string;
  readonly value: string;
}

const number = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1 });

export function keyFigures(s: TakeoffSummary): KeyFigure[] {
  const slivers = s.cuts.slivers ? ` (${s.cuts.slivers} slivers)` : '';
  return [
    { label: 'Area', value: `${number.format(s.netAreaM2)} m²` },
    { label: 'Tiles laid', value: number.format(s.tiles.full + s.tiles.cut) },
    {
      label: 'Tiles to order',
      value: `${number.format(s.tiles.toOrder)} in ${s.tiles.packs} boxes`,
    },
    {
      label: 'Thinnest cut',
      value:
        s.cuts.smallestMm === null ? 'no cuts' : `${number.format(s.cuts.smallestMm)} mm${slivers}`,
    },
    {
      label: 'Labour',
      value: `${number.format(s.labour.hours.total)} h, ${s.labour.crewDaysRoundedUp} day${s.labour.crewDaysRoundedUp === 1 ? '' : 's'} for ${s.labour.crewSize}`,
    },
  ];
}
