import { describe, expect, it } from 'vitest';
import {
  curdPressure,
  curdPressureKPa,
  mouldFaceAreaM2,
  pressSchedulePressures,
} from '../../../shared/trade/pressure';
import {
  CALCIUM_CHLORIDE_MAX_PERCENT_OF_MILK,
  calciumChlorideFromSolutionKg,
  checkCalciumChloride,
  ratePerKgOfCurd,
  ratePerLitreOfMilk,
  saltForCurdKg,
  saltInMoisturePercent,
  saltPercentOfCurd,
} from '../../../shared/trade/salt';
import { amountToSi, toLitres, toMillimetres, toNewtons } from '../../../shared/trade/units';

describe('salt, colouring and calcium chloride rates', () => {
  it('salt as % of curd mass (definition); 2 % of 5 kg of curd is 100 g', () => {
    expect(saltPercentOfCurd(0.1, 5)).toBeCloseTo(2, 12);
    expect(saltForCurdKg(5, 2)).toBeCloseTo(0.1, 12);
    expect(() => saltPercentOfCurd(0.1, 0)).toThrow(RangeError);
  });

  it('rates per litre of milk keep the dimension: g/L, mL/L, drops/L (proportion)', () => {
    const gallon = toLitres(1, 'gal');
    const salt = ratePerLitreOfMilk(amountToSi(28, 'g'), 10);
    expect(salt).toEqual({ dimension: 'mass', value: 2.8, unit: 'g/L' });
    // 1 tbsp per US gallon is 3.906 mL/L (NIST SP 811 App. B factors)
    const tbsp = ratePerLitreOfMilk(amountToSi(1, 'tbsp'), gallon);
    expect(tbsp.unit).toBe('mL/L');
    expect(tbsp.value).toBeCloseTo(14.78676478125 / 3.785411784, 12);
    // annatto counted in drops stays in drops
    expect(ratePerLitreOfMilk(amountToSi(8, 'drop'), 16)).toEqual({
      dimension: 'count',
      value: 0.5,
      unit: 'drops/L',
    });
  });

  it('rates per kilogram of curd: g/kg, mL/kg, drops/kg (proportion)', () => {
    expect(ratePerKgOfCurd(amountToSi(50, 'g'), 2.5)).toEqual({
      dimension: 'mass',
      value: 20,
      unit: 'g/kg',
    });
    expect(ratePerKgOfCurd(amountToSi(5, 'mL'), 2).unit).toBe('mL/kg');
  });

  it('salt in moisture from salt and moisture % falls in the cheddar range 4.3-4.9 % (cheese-science texts, TRADE.md)', () => {
    // Salt in cheese 1.5-1.9 %, cheddar moisture ~37 %; S/M = salt % / moisture % × 100.
    const sm = saltInMoisturePercent(1.7, 37);
    expect(sm).toBeCloseTo(4.595, 3);
    expect(sm).toBeGreaterThanOrEqual(4.3);
    expect(sm).toBeLessThanOrEqual(4.9);
  });

  it('calcium chloride at most 0.02 % of milk weight, about 0.2 g per litre (21 CFR 133.113)', () => {
    expect(CALCIUM_CHLORIDE_MAX_PERCENT_OF_MILK).toBe(0.02);
    const atLimit = checkCalciumChloride(0.000206 * 10, 10);
    expect(atLimit.percentOfMilk).toBeCloseTo(0.02, 10);
    expect(atLimit.withinLimit).toBe(true);
    // about 0.2 g per litre of milk (1.030 kg/L × 0.02 % = 0.206 g/L)
    expect(atLimit.maxKg / 10).toBeCloseTo(0.000206, 9);
    expect(atLimit.gramsPerLitre).toBeCloseTo(0.206, 9);
    expect(atLimit.source).toMatch(/21 CFR 133\.113/);
    expect(checkCalciumChloride(0.003, 10).withinLimit).toBe(false);
  });

  it('calcium chloride from a solution of stated strength (arithmetic: mL × g/100 mL)', () => {
    // 5 mL of a 30 g/100 mL solution holds 1.5 g
    expect(calciumChlorideFromSolutionKg(0.005, 30)).toBeCloseTo(0.0015, 12);
    expect(() => calciumChlorideFromSolutionKg(0.005, 0)).toThrow(RangeError);
  });
});

describe('pressure on the curd', () => {
  const eightInchRound = { shape: 'round', diameterMm: toMillimetres(8, 'in') } as const;

  it('a 50 lb load on an 8-inch round mould is about 1.0 psi, 6.9 kPa (common practice, no published source)', () => {
    const p = curdPressure(toNewtons(50, 'lbf'), eightInchRound);
    expect(p.psi).toBeCloseTo(1.0, 1);
    expect(p.kPa).toBeCloseTo(6.9, 1);
    // Independent check in inch-pound units: 50 lbf / (π × 4 in × 4 in) = 0.99472 psi.
    expect(p.psi).toBeCloseTo(50 / (Math.PI * 16), 10);
  });

  it('mould face areas: circle π d²/4, rectangle w × l (geometry)', () => {
    expect(mouldFaceAreaM2({ shape: 'round', diameterMm: 200 })).toBeCloseTo(Math.PI * 0.01, 14);
    expect(mouldFaceAreaM2({ shape: 'rectangular', widthMm: 100, lengthMm: 200 })).toBeCloseTo(
      0.02,
      14,
    );
    expect(() => mouldFaceAreaM2({ shape: 'round', diameterMm: 0 })).toThrow(RangeError);
  });

  it('pressure = force / area: 10 kgf on a 10 cm square is 9.80665 kPa (SI definition, NIST SP 811)', () => {
    const face = { shape: 'rectangular', widthMm: 100, lengthMm: 100 } as const;
    expect(curdPressureKPa(toNewtons(10, 'kgf'), face)).toBeCloseTo(9.80665, 10);
  });

  it('works out each stage of a press schedule', () => {
    const stages = pressSchedulePressures(
      [
        { loadN: toNewtons(10, 'lbf'), minutes: 15 },
        { loadN: toNewtons(20, 'lbf'), minutes: 30 },
        { loadN: toNewtons(50, 'lbf'), minutes: 720 },
      ],
      eightInchRound,
    );
    expect(stages.map((s) => [s.stage, s.startMinute, s.endMinute])).toEqual([
      [1, 0, 15],
      [2, 15, 45],
      [3, 45, 765],
    ]);
    expect(stages[0].psi).toBeCloseTo(10 / (Math.PI * 16), 10);
    expect(stages[2].psi).toBeCloseTo(stages[0].psi * 5, 10);
    expect(() => pressSchedulePressures([{ loadN: 100, minutes: -5 }], eightInchRound)).toThrow(
      RangeError,
    );
  });
});
