import { DEFAULT_RATES, type TakeoffInput } from '@latchwork/takeoff';
import { takeoffInputOf } from '../../takeoff/model/floor-draft';
import { draftFromInput } from './draft-from-input';

const warehouse: TakeoffInput = {
  outline: [
    [0, 0],
    [40000, 0],
    [40000, 25000],
    [0, 25000],
  ],
  obstacles: [
    [
      [7750, 7750],
      [8250, 7750],
      [8250, 8250],
      [7750, 8250],
    ],
    // A round column drawn as an octagon stays a polygon.
    [
      [20000, 12000],
      [20300, 12100],
      [20400, 12400],
      [20300, 12700],
      [20000, 12800],
      [19700, 12700],
      [19600, 12400],
      [19700, 12100],
    ],
  ],
  doorways: [{ from: [20000, 0], to: [16000, 0], ramp: true }],
  tile: { pitchMm: 500 },
  gapMm: 8,
  origin: { x: 5, y: 5 },
  pattern: { kind: 'border', rows: 2, borderColour: 'Signal yellow', fieldColour: 'Graphite' },
  zones: {
    adhesive: [
      [
        [15000, 0],
        [21000, 0],
        [21000, 4000],
        [15000, 4000],
      ],
    ],
    levelling: [
      {
        polygon: [
          [1000, 1000],
          [3000, 1000],
          [3000, 2000],
          [1000, 2000],
        ],
        depthMm: 6,
      },
    ],
  },
};

describe('draftFromInput', () => {
  it('opens a saved floor so that saving it again gives the same input', () => {
    const draft = draftFromInput(warehouse, 'Warehouse floor', 'metric');
    expect(draft.name).toBe('Warehouse floor');
    expect(draft.obstacles[0]).toEqual({ kind: 'rect', x: 7750, y: 7750, w: 500, l: 500 });
    expect(draft.obstacles[1]?.kind).toBe('polygon');
    expect(draft.doorways).toEqual([{ wall: 0, offsetMm: 16000, widthMm: 4000, ramp: true }]);
    const again = takeoffInputOf(draft, DEFAULT_RATES);
    expect(again.outline).toEqual(warehouse.outline);
    expect(again.obstacles).toEqual(warehouse.obstacles);
    expect(again.zones).toEqual(warehouse.zones);
    expect(again.pattern).toEqual(warehouse.pattern);
    expect(again.origin).toEqual({ x: 5, y: 5 });
    expect(again.gapMm).toBe(8);
    // The doorway comes back in wall order (from the wall's first corner), same opening.
    expect(again.doorways).toEqual([{ from: [16000, 0], to: [20000, 0], ramp: true }]);
  });

  it('drops a doorway that lies on no wall rather than misplacing it', () => {
    const draft = draftFromInput(
      { ...warehouse, doorways: [{ from: [100, 100], to: [900, 100] }] },
      'Odd',
      'imperial',
    );
    expect(draft.doorways).toEqual([]);
    expect(draft.units).toBe('imperial');
  });
});
