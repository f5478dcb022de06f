import { describe, expect, it } from 'vitest';
import {
  COW_MILK_DENSITY_KG_PER_L,
  milkDensity,
  milkMassKg,
  milkVolumeLitres,
} from '../../../shared/trade/milk';
import {
  amountForMilk,
  amountPerLitreOfMilk,
  scaleAmount,
  scaleAmounts,
  scaleFactor,
} from '../../../shared/trade/scaling';
import { fromKilograms, fromLitres, toLitres } from '../../../shared/trade/units';
import type { AmountUnit } from '../../../shared/trade/units';

describe('milk mass from volume', () => {
  // Density of whole cow's milk about 1.030 kg/L at 20 °C: H. D. Goff, Dairy Science and
  // Technology Education (University of Guelph); Fox and McSweeney, Advanced Dairy Chemistry 3.
  it("uses 1.030 kg/L for cow's milk (Goff, Guelph; Fox and McSweeney)", () => {
    expect(COW_MILK_DENSITY_KG_PER_L).toBe(1.03);
    expect(milkDensity('cow')).toMatchObject({ kgPerL: 1.03, assumed: false });
    expect(milkMassKg(10)).toBeCloseTo(10.3, 12);
  });

  it('one US gallon of milk weighs about 3.90 kg, 8.6 lb (TRADE.md, from Goff and NIST SP 811)', () => {
    const kg = milkMassKg(toLitres(1, 'gal'));
    expect(kg).toBeCloseTo(3.9, 2);
    expect(fromKilograms(kg, 'lb')).toBeCloseTo(8.6, 1);
  });

  it('flags the cow value as an assumption for species without a published figure at hand', () => {
    for (const species of ['goat', 'sheep', 'buffalo', 'other'] as const) {
      const d = milkDensity(species);
      expect(d.assumed).toBe(true);
      expect(d.kgPerL).toBe(COW_MILK_DENSITY_KG_PER_L);
      expect(d.source).toMatch(/No published density/);
    }
  });

  it('takes a measured density when the maker has one, and converts back to volume', () => {
    expect(milkMassKg(20, 'goat', 1.032)).toBeCloseTo(20.64, 12);
    expect(milkVolumeLitres(10.3)).toBeCloseTo(10, 12);
    expect(() => milkMassKg(-1)).toThrow(RangeError);
  });
});

describe('scaling a journal to another milk volume', () => {
  const twoGallons = toLitres(2, 'gal');
  const fourGallons = toLitres(4, 'gal');

  // Common practice, no published source: ingredient amounts scale in proportion to milk.
  it('a two-gallon recipe made with four gallons doubles every amount (common practice, no published source)', () => {
    const recipe: { name: string; amount: number; unit: AmountUnit }[] = [
      { name: 'mesophilic culture', amount: 0.25, unit: 'tsp' },
      { name: 'annatto', amount: 4, unit: 'drop' },
      { name: 'calcium chloride solution', amount: 0.5, unit: 'tsp' },
      { name: 'rennet', amount: 2.5, unit: 'mL' },
      { name: 'salt', amount: 28, unit: 'g' },
    ];
    const scaled = scaleAmounts(recipe, twoGallons, fourGallons);
    expect(scaleFactor(twoGallons, fourGallons)).toBe(2);
    scaled.forEach((item, i) => {
      expect(item.amount).toBeCloseTo(recipe[i].amount * 2, 12);
      expect(item.unit).toBe(recipe[i].unit);
      expect(item.name).toBe(recipe[i].name);
    });
    // the input is not changed
    expect(recipe[0].amount).toBe(0.25);
  });

  it('one tablespoon of salt per gallon makes four tablespoons for four gallons (common practice, no published source)', () => {
    const perLitre = amountPerLitreOfMilk(1, toLitres(1, 'gal'));
    expect(amountForMilk(perLitre, fourGallons)).toBeCloseTo(4, 12);
    expect(scaleAmount(1, toLitres(1, 'gal'), fourGallons)).toBeCloseTo(4, 12);
    // 1 tbsp per gallon is 3.906 mL per litre (NIST SP 811: 14.787 mL / 3.785 L).
    const mlPerLitre = amountPerLitreOfMilk(toLitres(1, 'tbsp') * 1000, toLitres(1, 'gal'));
    expect(mlPerLitre).toBeCloseTo(14.78676478125 / 3.785411784, 12);
    expect(fromLitres(toLitres(4, 'tbsp'), 'cup')).toBeCloseTo(0.25, 12);
  });

  it('rejects a zero or negative milk volume', () => {
    expect(() => scaleFactor(0, 10)).toThrow(RangeError);
    expect(() => amountPerLitreOfMilk(1, -2)).toThrow(RangeError);
    expect(() => scaleAmount(Number.NaN, 1, 2)).toThrow(RangeError);
  });
});
