import type { UNIT_SYSTEMS } from '../shop/shop.schema.js';

export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

// Exact by definition (NIST Handbook 44 Appendix C; NIST SP 811): 1 US gallon = 231 in³ with
// 1 in = 2.54 cm, a quart is a quarter gallon; 1 lbf·ft = 0.3048 m × 4.4482216152605 N.
export const LITRES_PER_US_GALLON = 3.785411784;
export const LITRES_PER_US_QUART = 0.946352946;
// = 1.355 817 948 331 400 4 exactly; the double nearest to it prints as …003.
export const NEWTON_METRES_PER_POUND_FOOT = 0.3048 * 4.4482216152605;

// NIST SP 811: t/°C = (t/°F − 32) / 1.8.
export const celsiusFromFahrenheit = (f: number): number => (f - 32) / 1.8;
export const fahrenheitFromCelsius = (c: number): number => c * 1.8 + 32;
export const usQuartsFromLitres = (litres: number): number => litres / LITRES_PER_US_QUART;
export const litresFromUsQuarts = (quarts: number): number => quarts * LITRES_PER_US_QUART;
export const usGallonsFromLitres = (litres: number): number => litres / LITRES_PER_US_GALLON;
export const litresFromUsGallons = (gallons: number): number => gallons * LITRES_PER_US_GALLON;
export const poundFeetFromNewtonMetres = (nm: number): number => nm / NEWTON_METRES_PER_POUND_FOOT;
export const newtonMetresFromPoundFeet = (lbfFt: number): number => lbfFt * NEWTON_METRES_PER_POUND_FOOT;

/** A temperature typed in the shop's units, as °C (the unit everything is stored in). */
export function toCelsius(value: number, system: UnitSystem): number {
  return system === 'us' ? celsiusFromFahrenheit(value) : value;
}

/** A stored °C value in the shop's units. */
export function fromCelsius(celsius: number, system: UnitSystem): number {
  return system === 'us' ? fahrenheitFromCelsius(celsius) : celsius;
}

export const temperatureUnit = (system: UnitSystem): string => (system === 'us' ? '°F' : '°C');

function formatNumber(value: number, maximumFractionDigits: number): string {
  // en-US, no grouping: a reading like "1250" is clearer on a gloved-hand tablet than "1,250".
  const text = value.toLocaleString('en-US', { maximumFractionDigits, useGrouping: false });
  return text === '-0' ? '0' : text;
}

/** '45 °C' / '113 °F' (SI style: a space between number and unit). */
export function formatTemperature(celsius: number, system: UnitSystem, fractionDigits = 0): string {
  return `${formatNumber(fromCelsius(celsius, system), fractionDigits)} ${temperatureUnit(system)}`;
}

/** '4 L' / '4.2 qt': fluid quantities are quoted in quarts in US shops. */
export function formatVolume(litres: number, system: UnitSystem, fractionDigits = 1): string {
  return system === 'us'
    ? `${formatNumber(usQuartsFromLitres(litres), fractionDigits)} qt`
    : `${formatNumber(litres, fractionDigits)} L`;
}

/** '100 N·m' / '74 lbf·ft'. */
export function formatTorque(newtonMetres: number, system: UnitSystem, fractionDigits = 0): string {
  return system === 'us'
    ? `${formatNumber(poundFeetFromNewtonMetres(newtonMetres), fractionDigits)} lbf·ft`
    : `${formatNumber(newtonMetres, fractionDigits)} N·m`;
}
