import { describe, expect, it } from 'vitest';
import {
  DEFAULT_SLAB_LIMITS,
  G_M2_PER_LB_1000FT2,
  emissionToImperial,
  emissionToMetric,
  regularityLimit,
  resolveSlabLimits,
} from './slab-limits';
import { SlabReadingError, evaluateReading, type SlabReading } from './slab-readings';
import { GOVERNING_NOTE, surveyWarnings } from './survey-warnings';

const rh = (value: number, extra: Partial<SlabReading> = {}): SlabReading => ({
  kind: 'relative_humidity',
  method: 'hood_hygrometer',
  value,
  ...extra,
});
const status = (r: SlabReading, limits = DEFAULT_SLAB_LIMITS) => evaluateReading(r, limits).status;

describe('moisture emission units (NIST SP 811 Appendix B factors)', () => {
  it('1 lb/1000 ft²/24 h = 453.59237 g / 92.90304 m² per 24 h', () => {
    // NIST SP 811: 1 lb = 0.45359237 kg, 1 ft² = 0.09290304 m²; 1000 ft² = 92.90304 m².
    expect(G_M2_PER_LB_1000FT2).toBeCloseTo(453.59237 / 92.90304, 12);
    // From memory: the usual rounded figure, 4.8824 g/m²/24 h.
    expect(G_M2_PER_LB_1000FT2).toBeCloseTo(4.8824, 4);
    // ASTM F1869 limit 3 lb/1000 ft²/24 h ≈ 14.65 g/m²/24 h (NIST factors, by hand).
    expect(emissionToMetric(3)).toBeCloseTo((3 * 453.59237) / 92.90304, 10);
    expect(emissionToImperial(emissionToMetric(2.7))).toBeCloseTo(2.7, 12);
  });
});

describe('evaluateReading against the default limits', () => {
  it('relative humidity ≤ 75 % (BS 8203; ASTM F2170 via ASTM F710), warn band 5 % (README)', () => {
    expect(status(rh(60))).toBe('pass');
    expect(status(rh(71.2))).toBe('pass');
    expect(status(rh(71.25))).toBe('warn'); // 75 − 5 % of 75
    expect(status(rh(75))).toBe('warn'); // "≤ 75 %": at the limit passes the limit
    expect(status(rh(75.1))).toBe('fail');
    expect(status(rh(80, { method: 'in_slab_probe' }))).toBe('fail');
    const r = evaluateReading(rh(82));
    expect(r.source).toMatch(/BS 8203/);
    expect(r.source).toMatch(/ASTM F2170/);
    expect(r.limit.value).toBe(75);
    expect(r.message).toBe(
      'Relative humidity 82 % (hood hygrometer) is over the 75 % limit. The slab is too wet to lay on: let it dry and re-test, or use a moisture barrier the manufacturer approves.',
    );
  });

  it('calcium chloride emission ≤ 3 lb/1000 ft²/24 h (ASTM F1869), either unit', () => {
    const e = (value: number, unit?: SlabReading['unit']): SlabReading => ({
      kind: 'moisture_emission',
      method: 'calcium_chloride',
      value,
      unit,
    });
    expect(status(e(2.5))).toBe('pass');
    expect(status(e(2.9))).toBe('warn');
    expect(status(e(3))).toBe('warn');
    expect(status(e(3.2))).toBe('fail');
    // 15 g/m²/24 h = 15 / 4.8824… ≈ 3.07 lb: over (NIST factors).
    expect(status(e(15, 'g_per_m2_24h'))).toBe('fail');
    expect(status(e(14, 'g_per_m2_24h'))).toBe('warn'); // ≈ 2.87 lb
    const r = evaluateReading(e(3.5));
    expect(r.source).toMatch(/ASTM F1869/);
    expect(r.message).toContain('3.5 lb/1000 ft²/24 h (17.09 g/m²/24 h');
  });

  it('surface regularity SR2 5 mm under 2 m (BS 8204); SR1 3 mm, SR3 10 mm', () => {
    const sr = (value: number): SlabReading => ({
      kind: 'surface_regularity',
      method: 'straightedge_2m',
      value,
    });
    expect(status(sr(4))).toBe('pass');
    expect(status(sr(4.8))).toBe('warn');
    expect(status(sr(5))).toBe('warn');
    expect(status(sr(6))).toBe('fail');
    expect(regularityLimit('SR1').value).toBe(3);
    expect(regularityLimit('SR3').value).toBe(10);
    const sr1 = resolveSlabLimits({ surface_regularity: regularityLimit('SR1') });
    expect(status(sr(4), sr1)).toBe('fail');
    const sr3 = { ...DEFAULT_SLAB_LIMITS, surface_regularity: regularityLimit('SR3') };
    expect(status(sr(9), sr3)).toBe('pass');
    expect(evaluateReading(sr(6)).source).toMatch(/BS 8204 class SR2/);
  });

  it('air and slab temperature ≥ 15 °C (common practice), warn band 1 °C (README)', () => {
    const t = (kind: 'air_temperature' | 'slab_temperature', value: number): SlabReading => ({
      kind,
      method: kind === 'air_temperature' ? 'thermometer' : 'infrared',
      value,
    });
    expect(status(t('air_temperature', 18))).toBe('pass');
    expect(status(t('air_temperature', 16))).toBe('warn');
    expect(status(t('air_temperature', 15))).toBe('warn');
    expect(status(t('slab_temperature', 14.9))).toBe('fail');
    expect(status(t('slab_temperature', -2))).toBe('fail');
    expect(evaluateReading(t('air_temperature', 11)).message).toMatch(/below the 15 °C limit/);
  });

  it('refuses readings that are typing slips or mismatched methods', () => {
    expect(() => evaluateReading(rh(120))).toThrow(SlabReadingError);
    expect(() => evaluateReading(rh(Number.NaN))).toThrow(/between 0 and 100/);
    expect(() => evaluateReading({ ...rh(50), method: 'infrared' })).toThrow(/hygrometer/);
    expect(() => evaluateReading({ ...rh(50), unit: 'g_per_m2_24h' })).toThrow(/unit/);
  });
});

describe('firm overrides', () => {
  it('a new value brings its own 5 % band and says where it came from', () => {
    const limits = resolveSlabLimits({ relative_humidity: { value: 85 } });
    expect(limits.relative_humidity.warnMargin).toBeCloseTo(4.25, 12);
    expect(limits.relative_humidity.source).toBe("firm's setting");
    expect(status(rh(80), limits)).toBe('pass');
    expect(status(rh(82), limits)).toBe('warn');
    expect(limits.moisture_emission).toBe(DEFAULT_SLAB_LIMITS.moisture_emission);
    expect(() => resolveSlabLimits({ air_temperature: { warnMargin: -1 } })).toThrow(RangeError);
  });
});

describe('surveyWarnings', () => {
  it('one warning per failing kind, with counts, the worst spot and the source', () => {
    const warnings = surveyWarnings([
      rh(70, { id: 'a' }),
      rh(78, { id: 'b', location: 'bay 1' }),
      rh(83, { id: 'c', location: 'by the roller door' }),
      rh(74),
      { kind: 'slab_temperature', method: 'surface_probe', value: 12, id: 'd' },
      { kind: 'air_temperature', method: 'thermometer', value: 15.5 },
    ]);
    expect(warnings.map((w) => w.kind)).toEqual(['relative_humidity', 'slab_temperature']);
    const [wet, cold] = warnings;
    expect(wet).toMatchObject({
      title: 'Slab too wet',
      failed: 2,
      total: 4,
      worst: { value: 83, id: 'c', location: 'by the roller door' },
      readingIds: ['b', 'c'],
    });
    expect(wet.message).toMatch(/^2 of 4 relative humidity readings over 75 % \(worst 83 %/);
    expect(wet.message).toContain(GOVERNING_NOTE);
    expect(wet.source).toMatch(/BS 8203/);
    expect(cold).toMatchObject({ title: 'Slab too cold', worst: { value: 12 } });
  });

  it('for a minimum limit the worst is the lowest value', () => {
    const w = surveyWarnings([
      { kind: 'air_temperature', method: 'thermometer', value: 12 },
      { kind: 'air_temperature', method: 'thermometer', value: 8 },
    ]);
    expect(w[0].worst.value).toBe(8);
  });

  it('nothing for passing or merely close readings', () => {
    expect(surveyWarnings([rh(75), rh(40)])).toEqual([]);
    expect(surveyWarnings([])).toEqual([]);
  });
});
