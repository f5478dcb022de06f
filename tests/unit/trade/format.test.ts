import { describe, expect, it } from 'vitest';
import {
  displayLengthUnit,
  displayMassUnit,
  displayVolumeUnit,
  formatAmount,
  formatEnteredAmount,
  formatLength,
  formatLoad,
  formatMass,
  formatNumber,
  formatPressure,
  formatQuantity,
  formatTemperature,
  formatTemperatureDelta,
  formatVolume,
} from '../../../shared/trade/format';
import { milkMassKg } from '../../../shared/trade/milk';
import { toKilograms, toLitres, toMillimetres, toNewtons } from '../../../shared/trade/units';
import type { AmountUnit } from '../../../shared/trade/units';

// Display rules are common practice, no published source: three significant digits, no
// trailing zeros. The spacing ("3.79 L", "100 °F") follows NIST SP 811 §7.2 and §7.2's note
// on °C: a space between the number and the unit symbol. Converted values: NIST SP 811 App. B.

describe('formatNumber (common practice, no published source)', () => {
  it('keeps three significant digits, drops trailing zeros, never rounds away integers', () => {
    expect(formatNumber(3.785411784)).toBe('3.79');
    expect(formatNumber(8.5957)).toBe('8.6');
    expect(formatNumber(1.0000001)).toBe('1');
    expect(formatNumber(1234.56)).toBe('1235');
    expect(formatNumber(0.125)).toBe('0.125');
    expect(formatNumber(0.0001)).toBe('0');
    expect(formatNumber(-0.0001)).toBe('0');
    expect(formatNumber(0)).toBe('0');
    expect(formatNumber(Number.NaN)).toBe('–');
  });
});

describe('the examples in the issue', () => {
  it('one US gallon reads "3.79 L" and "1 gal" (NIST SP 811: 3.785411784 L)', () => {
    const gallon = toLitres(1, 'gal');
    expect(formatVolume(gallon, 'metric')).toBe('3.79 L');
    expect(formatVolume(gallon, 'us')).toBe('1 gal');
  });

  it('a gallon of milk weighs "8.6 lb" (1.030 kg/L, Goff, Guelph; TRADE.md)', () => {
    expect(formatMass(milkMassKg(toLitres(1, 'gal')), 'us')).toBe('8.6 lb');
    expect(formatMass(milkMassKg(toLitres(1, 'gal')), 'metric')).toBe('3.9 kg');
  });

  it('100 °F reads "100 °F" and "37.8 °C" (NIST SP 811 App. B)', () => {
    const c = (100 - 32) / 1.8;
    expect(formatTemperature(c, 'us')).toBe('100 °F');
    expect(formatTemperature(c, 'metric')).toBe('37.8 °C');
    expect(formatTemperature(31, 'us')).toBe('87.8 °F');
  });
});

describe('display units (common practice, no published source)', () => {
  it('small volumes in mL or tsp/tbsp/cup, larger in L or qt/gal', () => {
    expect(formatVolume(0.5, 'metric')).toBe('500 mL');
    expect(formatVolume(0.0025, 'metric')).toBe('2.5 mL');
    expect(formatVolume(toLitres(0.5, 'gal'), 'us')).toBe('2 qt');
    expect(formatVolume(toLitres(3, 'cup'), 'us')).toBe('3 cups');
    expect(formatVolume(toLitres(1, 'cup'), 'us')).toBe('1 cup');
    expect(formatVolume(toLitres(3, 'tbsp'), 'us')).toBe('3 tbsp');
    expect(formatVolume(toLitres(0.25, 'tsp'), 'us')).toBe('0.25 tsp');
    expect(displayVolumeUnit(toLitres(2.5, 'gal'), 'us')).toBe('gal');
    expect(formatVolume(toLitres(4, 'gal'), 'metric', 'L')).toBe('15.1 L');
  });

  it('small masses in g or oz, larger in kg or lb', () => {
    expect(formatMass(0.45, 'metric')).toBe('450 g');
    expect(formatMass(0.0005, 'metric')).toBe('0.5 g');
    expect(formatMass(toKilograms(6, 'oz'), 'us')).toBe('6 oz');
    expect(formatMass(toKilograms(4, 'lb'), 'us')).toBe('4 lb');
    expect(displayMassUnit(2, 'metric')).toBe('kg');
    expect(formatMass(1.5, 'us', 'oz')).toBe('52.9 oz');
  });

  it('lengths in mm, cm or inches', () => {
    expect(formatLength(toMillimetres(8, 'in'), 'us')).toBe('8 in');
    expect(formatLength(toMillimetres(8, 'in'), 'metric')).toBe('20.3 cm');
    expect(formatLength(6, 'metric')).toBe('6 mm');
    expect(displayLengthUnit(150, 'metric')).toBe('cm');
  });

  it('press loads in kg or lb of weight, pressures in kPa or psi', () => {
    expect(formatLoad(toNewtons(50, 'lbf'), 'us')).toBe('50 lb');
    expect(formatLoad(toNewtons(50, 'lbf'), 'metric')).toBe('22.7 kg');
    expect(formatPressure(6.894757293168, 'us')).toBe('1 psi');
    expect(formatPressure(6.858, 'metric')).toBe('6.86 kPa');
  });

  it('temperature differences carry no offset (NIST SP 811 App. B)', () => {
    expect(formatTemperatureDelta(10 / 9, 'us')).toBe('2 °F');
    expect(formatTemperatureDelta(10 / 9, 'metric')).toBe('1.1 °C');
  });

  it('amounts: drops stay drops, volumes and masses follow the system', () => {
    expect(formatAmount({ dimension: 'count', value: 4 }, 'metric')).toBe('4 drops');
    expect(formatAmount({ dimension: 'count', value: 1 }, 'us')).toBe('1 drop');
    expect(formatAmount({ dimension: 'volume', value: toLitres(1, 'tbsp') }, 'us')).toBe('1 tbsp');
    expect(formatAmount({ dimension: 'mass', value: 0.0125 }, 'metric')).toBe('12.5 g');
    expect(formatEnteredAmount(0.5, 'tsp')).toBe('0.5 tsp');
    expect(() => formatEnteredAmount(1, 'pinch' as AmountUnit)).toThrow(RangeError);
    expect(formatQuantity(2, 'tbsp')).toBe('2 tbsp');
  });
});
