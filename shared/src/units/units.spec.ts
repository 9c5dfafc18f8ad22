import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  LITRES_PER_US_GALLON,
  LITRES_PER_US_QUART,
  NEWTON_METRES_PER_POUND_FOOT,
  celsiusFromFahrenheit,
  fahrenheitFromCelsius,
  formatTemperature,
  formatTorque,
  formatVolume,
  fromCelsius,
  litresFromUsGallons,
  litresFromUsQuarts,
  newtonMetresFromPoundFeet,
  poundFeetFromNewtonMetres,
  toCelsius,
  usGallonsFromLitres,
  usQuartsFromLitres,
} from './units.js';

describe('unit factors', () => {
  it('match NIST Handbook 44 Appendix C', () => {
    // NIST Handbook 44 Appendix C: 1 US gal = 231 in³ = 231 × 2.54³ cm³ = 3.785 411 784 L exactly.
    expect(LITRES_PER_US_GALLON).toBe(3.785411784);
    expect(231 * 2.54 ** 3).toBeCloseTo(3785.411784, 9);
    // Same source: 1 US qt = 0.946 352 946 L exactly (a quarter gallon).
    expect(LITRES_PER_US_QUART).toBe(0.946352946);
    expect(LITRES_PER_US_GALLON / 4).toBeCloseTo(LITRES_PER_US_QUART, 15);
    // NIST SP 811 Appendix B: 1 lbf·ft = 1.355 818 N·m (0.3048 m × 4.448 221 615 260 5 N).
    expect(NEWTON_METRES_PER_POUND_FOOT.toPrecision(16)).toBe('1.355817948331400');
    expect(newtonMetresFromPoundFeet(1)).toBeCloseTo(1.355818, 6);
  });
});

describe(celsiusFromFahrenheit.name, () => {
  it('follows t/°C = (t/°F − 32) / 1.8', () => {
    // NIST SP 811 (t/°C = (t/°F − 32)/1.8): 113 °F = 45 °C, 212 °F = 100 °C, 32 °F = 0 °C, −40 °F = −40 °C.
    expect(celsiusFromFahrenheit(113)).toBeCloseTo(45, 12);
    expect(celsiusFromFahrenheit(212)).toBeCloseTo(100, 12);
    expect(celsiusFromFahrenheit(32)).toBe(0);
    expect(celsiusFromFahrenheit(-40)).toBeCloseTo(-40, 12);
  });

  it('is undone by fahrenheitFromCelsius', () => {
    fc.assert(
      fc.property(fc.double({ min: -100, max: 400, noNaN: true }), (c) => {
        expect(celsiusFromFahrenheit(fahrenheitFromCelsius(c))).toBeCloseTo(c, 9);
      }),
    );
  });
});

describe('volume and torque conversions', () => {
  it('convert with the exact factors', () => {
    // NIST Handbook 44 App. C: 4 qt = 1 gal = 3.785 411 784 L.
    expect(litresFromUsQuarts(4)).toBeCloseTo(3.785411784, 12);
    expect(usQuartsFromLitres(3.785411784)).toBeCloseTo(4, 12);
    expect(litresFromUsGallons(2)).toBeCloseTo(7.570823568, 12);
    expect(usGallonsFromLitres(7.570823568)).toBeCloseTo(2, 12);
    // NIST SP 811: 100 lbf·ft = 135.581 794 833 140 04 N·m.
    expect(newtonMetresFromPoundFeet(100)).toBeCloseTo(135.58179483314004, 10);
    expect(poundFeetFromNewtonMetres(135.58179483314004)).toBeCloseTo(100, 10);
  });
});

describe(toCelsius.name, () => {
  it('reads a typed value in the shop units', () => {
    // NIST SP 811: 113 °F = 45 °C.
    expect(toCelsius(113, 'us')).toBeCloseTo(45, 12);
    expect(toCelsius(45, 'metric')).toBe(45);
    expect(fromCelsius(45, 'us')).toBeCloseTo(113, 12);
  });
});

describe(formatTemperature.name, () => {
  it('writes the value with its unit', () => {
    // NIST SP 811: 45 °C = 45 × 1.8 + 32 = 113 °F; −17.8 °C ≈ 0 °F.
    expect(formatTemperature(45, 'metric')).toBe('45 °C');
    expect(formatTemperature(45, 'us')).toBe('113 °F');
    expect(formatTemperature(-17.8, 'us')).toBe('0 °F');
    expect(formatTemperature(-0.2, 'metric')).toBe('0 °C');
    expect(formatTemperature(71.25, 'metric', 1)).toBe('71.3 °C');
  });
});

describe(formatVolume.name, () => {
  it('gives litres or US quarts', () => {
    // NIST Handbook 44 App. C: 4 L ÷ 0.946 352 946 L/qt = 4.227 qt.
    expect(formatVolume(4, 'metric')).toBe('4 L');
    expect(formatVolume(4, 'us')).toBe('4.2 qt');
    expect(formatVolume(4, 'us', 2)).toBe('4.23 qt');
  });
});

describe(formatTorque.name, () => {
  it('gives N·m or lbf·ft', () => {
    // NIST SP 811: 100 N·m ÷ 1.355 818 = 73.76 lbf·ft.
    expect(formatTorque(100, 'metric')).toBe('100 N·m');
    expect(formatTorque(100, 'us')).toBe('74 lbf·ft');
    expect(formatTorque(100, 'us', 1)).toBe('73.8 lbf·ft');
  });
});
