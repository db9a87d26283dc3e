import type { TakeoffSummary } from '../survey-api';
import { keyFigures } from './key-figures';

// Only the parts of a summary the list reads; the engine's own tests cover the figures.
const summary = {
  netAreaM2: 39,
  tiles: { full: 132, cut: 24, toOrder: 170, packs: 17 },
  cuts: { smallestMm: 245, slivers: 0 },
  labour: { hours: { total: 6.5 }, crewDaysRoundedUp: 1, crewSize: 2 },
} as unknown as TakeoffSummary;

describe('keyFigures', () => {
  it('lists the tiles laid (full + cut, as the floor editor counts them) beside those to order', () => {
    expect(keyFigures(summary)).toEqual([
      { label: 'Area', value: '39 m²' },
      { label: 'Tiles laid', value: '156' },
      { label: 'Tiles to order', value: '170 in 17 boxes' },
      { label: 'Thinnest cut', value: '245 mm' },
      { label: 'Labour', value: '6.5 h, 1 day for 2' },
    ]);
  });
});
