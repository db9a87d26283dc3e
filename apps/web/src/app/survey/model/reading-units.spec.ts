import Decimal from 'decimal.js';
import { otherUnitText, unitLabel, valueText } from './reading-units';

describe('reading units', () => {
  it('shows an emission in the other unit by the NIST SP 811 factors', () => {
    // 1 lb = 453.59237 g and 1 ft² = 0.09290304 m² (NIST SP 811): 3 lb/1000 ft² in g/m².
    const expected = new Decimal(3).times('453.59237').div('92.90304').toDecimalPlaces(2);
    expect(otherUnitText('moisture_emission', 3, 'lb_per_1000ft2_24h')).toBe(
      `= ${expected.toString()} g/m²/24 h`,
    );
    expect(otherUnitText('moisture_emission', 14.65, 'g_per_m2_24h')).toBe('= 3 lb/1000 ft²/24 h');
    expect(otherUnitText('relative_humidity', 70, null)).toBeNull();
  });

  it('names the unit each kind is entered in', () => {
    expect(unitLabel('relative_humidity')).toBe('%');
    expect(unitLabel('surface_regularity')).toBe('mm');
    expect(unitLabel('slab_temperature')).toBe('°C');
    expect(valueText('moisture_emission', 3, null)).toBe('3 lb/1000 ft²/24 h (14.65 g/m²/24 h)');
  });
});
