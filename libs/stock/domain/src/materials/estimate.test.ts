import { describe, expect, it } from 'vitest';
import { estimateFromTakeoffs, materialKey } from './estimate';

describe('estimated materials from takeoffs', () => {
  it('adds two areas by kind and tile colour (arithmetic)', () => {
    const lines = estimateFromTakeoffs([
      {
        tiles: {
          byColour: [
            { colour: 'Graphite', toOrder: 96 },
            { colour: 'Amber', toOrder: 24 },
          ],
        },
        materials: {
          skirting: { pieces: 6 },
          cornerTrims: { internal: 2, external: 1 },
          adhesive: { kits: 2 },
          anchoring: { method: 'tape', units: 3 },
        },
      },
      {
        tiles: { byColour: [{ colour: 'graphite ', toOrder: 48 }] },
        materials: { adhesive: { kits: 1 } },
      },
    ]);
    const by = new Map(lines.map((l) => [materialKey(l.kind, l.colour), l.quantity]));
    expect(by.get('tile|graphite')).toBe(144);
    expect(by.get('tile|amber')).toBe(24);
    expect(by.get('corner_trim|')).toBe(3);
    expect(by.get('adhesive|')).toBe(3);
    expect(by.get('tape|')).toBe(3);
    expect(by.has('primer|')).toBe(false);
  });

  it('an empty or missing summary estimates nothing', () => {
    expect(estimateFromTakeoffs([{}])).toEqual([]);
  });
});
