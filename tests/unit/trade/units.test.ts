import convert from 'convert-units';
import { describe, expect, it } from 'vitest';
import {
  AMOUNT_UNITS,
  DEFAULT_ML_PER_DROP,
  KILOGRAMS_PER,
  KILOPASCALS_PER,
  LITRES_PER,
  MASS_UNITS,
  NEWTONS_PER,
  VOLUME_UNITS,
  amountDimension,
  amountFromSi,
  amountToLitres,
  amountToSi,
  convertMass,
  convertTemperature,
  convertVolume,
  deltaFromCelsius,
  deltaToCelsius,
  dropsToLitres,
  fromCelsius,
  fromKilograms,
  fromKilopascals,
  fromLitres,
  fromMillimetres,
  fromNewtons,
  litresToDrops,
  toCelsius,
  toKilograms,
  toKilopascals,
  toLitres,
  toMillimetres,
  toNewtons,
} from '../../../shared/trade/units';
import type { MassUnit, VolumeUnit } from '../../../shared/trade/units';
import { expectRelClose } from './helpers';

// Source for every exact value in this block: NIST SP 811, "Guide for the Use of the
// International System of Units" (2008), Appendix B (B.8 and B.9), as listed in TRADE.md.
const NIST_SP_811 = {
  litresPerGallon: 3.785411784,
  litresPerQuart: 0.946352946,
  millilitresPerCup: 236.5882365,
  millilitresPerTablespoon: 14.78676478125,
  millilitresPerTeaspoon: 4.92892159375,
  kilogramsPerPound: 0.45359237,
  gramsPerOunce: 28.349523125,
  millimetresPerInch: 25.4,
  newtonsPerPoundForce: 4.4482216152605,
  newtonsPerKilogramForce: 9.80665,
  pascalsPerPsi: 6894.757293168,
};

describe('unit factors against NIST SP 811 Appendix B', () => {
  it('volume: US gallon, quart, cup, tablespoon, teaspoon (NIST SP 811 App. B)', () => {
    expect(toLitres(1, 'gal')).toBe(NIST_SP_811.litresPerGallon);
    expect(toLitres(1, 'qt')).toBe(NIST_SP_811.litresPerQuart);
    expectRelClose(toLitres(1, 'cup') * 1000, NIST_SP_811.millilitresPerCup, 1e-15);
    expectRelClose(toLitres(1, 'tbsp') * 1000, NIST_SP_811.millilitresPerTablespoon, 1e-15);
    expectRelClose(toLitres(1, 'tsp') * 1000, NIST_SP_811.millilitresPerTeaspoon, 1e-15);
    expect(toLitres(1000, 'mL')).toBe(1);
  });

  it('volume: the gallon is 231 cubic inches of 25.4 mm (NIST SP 811 App. B footnote)', () => {
    // Independent derivation: 231 in³ × (2.54 cm)³ = 3785.411784 cm³.
    expectRelClose(LITRES_PER.gal, (231 * 2.54 ** 3) / 1000, 1e-15);
  });

  it('volume: 1 gal = 4 qt = 16 cup; 1 cup = 16 tbsp; 1 tbsp = 3 tsp (US customary, NIST Handbook 44 App. C)', () => {
    expectRelClose(LITRES_PER.qt * 4, LITRES_PER.gal, 1e-15);
    expectRelClose(LITRES_PER.cup * 16, LITRES_PER.gal, 1e-15);
    expectRelClose(LITRES_PER.tbsp * 16, LITRES_PER.cup, 1e-15);
    expectRelClose(LITRES_PER.tsp * 3, LITRES_PER.tbsp, 1e-15);
  });

  it('mass: pound and ounce (NIST SP 811 App. B); 16 oz = 1 lb (avoirdupois)', () => {
    expect(toKilograms(1, 'lb')).toBe(NIST_SP_811.kilogramsPerPound);
    expectRelClose(toKilograms(1, 'oz') * 1000, NIST_SP_811.gramsPerOunce, 1e-15);
    expectRelClose(KILOGRAMS_PER.oz * 16, KILOGRAMS_PER.lb, 1e-15);
    expect(toKilograms(1000, 'g')).toBe(1);
  });

  it('length: inch = 25.4 mm exactly; cm = 10 mm (NIST SP 811 App. B)', () => {
    expect(toMillimetres(1, 'in')).toBe(NIST_SP_811.millimetresPerInch);
    expect(toMillimetres(1, 'cm')).toBe(10);
  });

  it('force: kgf = 9.80665 N exactly, lbf = 4.4482216152605 N (NIST SP 811 App. B)', () => {
    expect(toNewtons(1, 'kgf')).toBe(NIST_SP_811.newtonsPerKilogramForce);
    expect(toNewtons(1, 'lbf')).toBe(NIST_SP_811.newtonsPerPoundForce);
    // Independent derivation: lbf = 1 lb × standard gravity 9.80665 m/s² (NIST SP 811 App. B).
    expectRelClose(
      NEWTONS_PER.lbf,
      NIST_SP_811.kilogramsPerPound * NIST_SP_811.newtonsPerKilogramForce,
      1e-15,
    );
  });

  it('pressure: psi = 6894.757293168 Pa = lbf / in² (NIST SP 811 App. B)', () => {
    expectRelClose(toKilopascals(1, 'psi') * 1000, NIST_SP_811.pascalsPerPsi, 1e-15);
    const lbfPerSquareInchPa = NIST_SP_811.newtonsPerPoundForce / (0.0254 * 0.0254);
    expectRelClose(KILOPASCALS_PER.psi * 1000, lbfPerSquareInchPa, 1e-12);
  });

  it('temperature: t(°C) = (t(°F) − 32) / 1.8; a 1 °F difference is 5/9 K (NIST SP 811 App. B)', () => {
    expect(toCelsius(32, 'F')).toBe(0);
    expect(toCelsius(212, 'F')).toBe(100);
    expect(toCelsius(-40, 'F')).toBe(-40);
    expect(fromCelsius(37, 'F')).toBeCloseTo(98.6, 12);
    expect(deltaToCelsius(1, 'F')).toBeCloseTo(5 / 9, 15);
    expect(deltaToCelsius(9, 'F')).toBe(5);
    expect(deltaFromCelsius(5, 'F')).toBe(9);
    // A difference carries no offset: 15 °F of rise is 8.33 °C, not (15 − 32) / 1.8.
    expect(deltaToCelsius(15, 'F')).toBeCloseTo(25 / 3, 12);
    expect(convertTemperature(100, 'F', 'C')).toBeCloseTo(37.7778, 4);
  });
});

// Independent cross-check: convert-units 2.3.4 (npm), which uses rounded factors that agree
// with NIST SP 811 to about 1e-6 relative (TRADE.md). It has no force unit.
describe('unit factors cross-checked with convert-units 2.3.4', () => {
  const tolerance = 1e-6;
  const volume: [VolumeUnit, string][] = [
    ['L', 'l'],
    ['mL', 'ml'],
    ['gal', 'gal'],
    ['qt', 'qt'],
    ['cup', 'cup'],
    ['tbsp', 'Tbs'],
    ['tsp', 'tsp'],
  ];
  const mass: [MassUnit, string][] = [
    ['kg', 'kg'],
    ['g', 'g'],
    ['lb', 'lb'],
    ['oz', 'oz'],
  ];

  it.each(volume)('volume %s (convert-units "%s")', (ours, theirs) => {
    expectRelClose(toLitres(1, ours), convert(1).from(theirs).to('l'), tolerance);
    expectRelClose(fromLitres(10, ours), convert(10).from('l').to(theirs), tolerance);
  });

  it.each(mass)('mass %s (convert-units "%s")', (ours, theirs) => {
    expectRelClose(toKilograms(1, ours), convert(1).from(theirs).to('kg'), tolerance);
    expectRelClose(fromKilograms(2, ours), convert(2).from('kg').to(theirs), tolerance);
  });

  it('length mm, cm, in (convert-units)', () => {
    for (const unit of ['mm', 'cm', 'in'] as const) {
      expectRelClose(toMillimetres(1, unit), convert(1).from(unit).to('mm'), tolerance);
      expectRelClose(fromMillimetres(250, unit), convert(250).from('mm').to(unit), tolerance);
    }
  });

  it('pressure kPa, psi (convert-units)', () => {
    expectRelClose(toKilopascals(1, 'psi'), convert(1).from('psi').to('kPa'), tolerance);
    expectRelClose(fromKilopascals(7, 'psi'), convert(7).from('kPa').to('psi'), tolerance);
  });

  it('temperature °C, °F (convert-units)', () => {
    for (const f of [-40, 32, 85, 100, 212]) {
      expect(toCelsius(f, 'F')).toBeCloseTo(convert(f).from('F').to('C'), 9);
    }
    for (const c of [-10, 0, 31, 38.5]) {
      expect(fromCelsius(c, 'F')).toBeCloseTo(convert(c).from('C').to('F'), 9);
    }
  });

  it('force has no convert-units counterpart; kgf → lbf goes through SI (NIST SP 811)', () => {
    // 1 kgf / 1 lbf = 9.80665 / 4.4482216152605 = 1 / 0.45359237 = 2.20462262... lb per kg.
    expectRelClose(fromNewtons(toNewtons(1, 'kgf'), 'lbf'), 1 / 0.45359237, 1e-14);
  });
});

describe('conversions between customary units (NIST SP 811 App. B)', () => {
  it('converts volume and mass between any two units', () => {
    expect(convertVolume(1, 'gal', 'qt')).toBeCloseTo(4, 12);
    expect(convertVolume(1, 'cup', 'tbsp')).toBeCloseTo(16, 12);
    expect(convertVolume(2, 'tbsp', 'tbsp')).toBe(2);
    expect(convertMass(1, 'lb', 'oz')).toBeCloseTo(16, 12);
    expect(convertMass(453.59237, 'g', 'lb')).toBeCloseTo(1, 12);
  });

  it('rejects values that are not numbers and unknown units', () => {
    expect(() => toLitres(Number.NaN, 'L')).toThrow(RangeError);
    expect(() => toKilograms(Infinity, 'kg')).toThrow(RangeError);
    expect(() => toLitres(1, 'pint' as VolumeUnit)).toThrow(RangeError);
  });
});

describe('drops: a counted unit with an explicit mL-per-drop assumption', () => {
  // 0.05 mL per drop (20 drops per mL) is common practice, no published source (TRADE.md).
  it('defaults to 0.05 mL per drop and takes an override (common practice, no published source)', () => {
    expect(DEFAULT_ML_PER_DROP).toBe(0.05);
    expect(dropsToLitres(20)).toBeCloseTo(0.001, 15);
    expect(dropsToLitres(20, 0.04)).toBeCloseTo(0.0008, 15);
    expect(litresToDrops(0.001)).toBeCloseTo(20, 12);
    expect(() => dropsToLitres(3, 0)).toThrow(RangeError);
  });

  it('keeps drops as a count: amountToSi never turns them into a volume', () => {
    expect(amountToSi(6, 'drop')).toEqual({ dimension: 'count', value: 6 });
    expect(() => amountToLitres(6, 'drop')).toThrow(/mL per drop/);
    expect(amountToLitres(6, 'drop', 0.05)).toBeCloseTo(0.0003, 15);
    expect(() => amountToLitres(1, 'g')).toThrow(RangeError);
  });
});

describe('amount units for ingredient amounts', () => {
  it('covers every volume and mass unit plus drops', () => {
    expect(AMOUNT_UNITS).toEqual([...VOLUME_UNITS, ...MASS_UNITS, 'drop']);
    expect(AMOUNT_UNITS.map(amountDimension)).toEqual([
      ...VOLUME_UNITS.map(() => 'volume'),
      ...MASS_UNITS.map(() => 'mass'),
      'count',
    ]);
  });

  it('converts a typed amount to its SI amount and back (NIST SP 811 App. B)', () => {
    expect(amountToSi(1, 'tbsp')).toEqual({ dimension: 'volume', value: 0.01478676478125 });
    const halfPound = amountToSi(8, 'oz');
    expect(halfPound.dimension).toBe('mass');
    expectRelClose(halfPound.value, 0.45359237 / 2, 1e-15);
    expect(amountFromSi({ dimension: 'mass', value: 0.45359237 }, 'lb')).toBe(1);
    expect(() => amountFromSi({ dimension: 'mass', value: 1 }, 'L')).toThrow(RangeError);
  });
});
