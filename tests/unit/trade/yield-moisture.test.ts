import { describe, expect, it } from 'vitest';
import { milkMassKg } from '../../../shared/trade/milk';
import {
  lossRatePercentPerWeek,
  massLossPercent,
  moistureLossSeries,
} from '../../../shared/trade/moisture';
import { toKilograms, toLitres } from '../../../shared/trade/units';
import {
  DEFAULT_CASEIN_FRACTION,
  VAN_SLYKE,
  caseinFromProtein,
  predictedCheeseKg,
  vanSlykeYield,
  yieldEfficiency,
  yieldKgPer100KgMilk,
  yieldPercent,
} from '../../../shared/trade/yield';

describe('Van Slyke predicted cheddar yield', () => {
  // Y = (0.93 F + C − 0.1) × 1.09 / (1 − W): L. L. Van Slyke and W. V. Price, "Cheese", 1949.
  // Worked values from TRADE.md, computed from the formula for F 3.6 %, C 2.5 %.
  it.each([
    [37, 9.945],
    [35, 9.639],
    [39, 10.271],
  ])('F 3.6, C 2.5, moisture %d %% gives %f kg/100 kg (TRADE.md worked values)', (w, expected) => {
    expect(vanSlykeYield({ fatPercent: 3.6, caseinPercent: 2.5, moisturePercent: w })).toBeCloseTo(
      expected,
      3,
    );
  });

  it('uses the published constants 0.93, 0.1 and 1.09 (Van Slyke and Price 1949)', () => {
    expect(VAN_SLYKE).toEqual({ fatRetained: 0.93, caseinLost: 0.1, otherSolidsFactor: 1.09 });
  });

  it('gives about 10 kg per 100 kg of milk for typical milk (rule of thumb, cheese-science texts)', () => {
    // Typical cow milk: fat 3.5-4 %, true protein ~3.2 % [memory, dairy-science texts];
    // cheddar at 37 % moisture. Texts give ~95 lb per 1000 lb of milk, about 10 kg/100 kg.
    for (const fatPercent of [3.5, 3.7, 4.0]) {
      const y = vanSlykeYield({ fatPercent, proteinPercent: 3.2, moisturePercent: 37 });
      expect(y).toBeGreaterThan(9);
      expect(y).toBeLessThan(11);
    }
  });

  it('derives casein from protein with a stated fraction, default 0.78 [memory]', () => {
    expect(DEFAULT_CASEIN_FRACTION).toBe(0.78); // [memory, general dairy-science texts]
    expect(caseinFromProtein(3.2)).toBeCloseTo(2.496, 12);
    expect(caseinFromProtein(3.2, 0.8)).toBeCloseTo(2.56, 12);
    const fromProtein = vanSlykeYield({
      fatPercent: 3.6,
      proteinPercent: 2.5 / 0.78,
      moisturePercent: 37,
    });
    expect(fromProtein).toBeCloseTo(9.945, 3);
    expect(() => caseinFromProtein(3.2, 1.5)).toThrow(RangeError);
  });

  it('rejects impossible moisture', () => {
    expect(() =>
      vanSlykeYield({ fatPercent: 3.6, caseinPercent: 2.5, moisturePercent: 100 }),
    ).toThrow(RangeError);
  });
});

describe('actual yield and efficiency', () => {
  it('about 4 lb of hard cheese from 4 US gallons is a yield near 11-12 % (common practice, no published source)', () => {
    const milkKg = milkMassKg(toLitres(4, 'gal'));
    const y = yieldPercent(toKilograms(4, 'lb'), milkKg);
    expect(y).toBeGreaterThan(11);
    expect(y).toBeLessThan(12);
    expect(yieldKgPer100KgMilk(toKilograms(4, 'lb'), milkKg)).toBe(y);
  });

  it('yield % is cheese mass over milk mass × 100 (definition, TRADE.md)', () => {
    expect(yieldPercent(9.5, 100)).toBeCloseTo(9.5, 12);
    expect(() => yieldPercent(1, 0)).toThrow(RangeError);
  });

  it('efficiency is actual / predicted (TRADE.md); predicted mass from the Van Slyke yield', () => {
    const predicted = vanSlykeYield({ fatPercent: 3.6, caseinPercent: 2.5, moisturePercent: 37 });
    expect(yieldEfficiency(9.945, predicted)).toBeCloseTo(1, 4);
    expect(yieldEfficiency(9.5, predicted)).toBeCloseTo(9.5 / 9.945, 3);
    expect(predictedCheeseKg(200, predicted)).toBeCloseTo(19.89, 2);
  });
});

describe('moisture loss while drying and aging', () => {
  it('a 4 lb wheel that loses 3 oz has lost about 4.7 % (common practice, no published source)', () => {
    const green = toKilograms(4, 'lb');
    const later = green - toKilograms(3, 'oz');
    // 3 oz / 64 oz = 4.6875 % (16 oz per lb, NIST SP 811 App. B)
    expect(massLossPercent(green, later)).toBeCloseTo(4.6875, 10);
    expect(massLossPercent(green, later)).toBeCloseTo(4.7, 1);
  });

  it('rate per week is the loss over the days × 7 (definition)', () => {
    expect(lossRatePercentPerWeek(3, 14)).toBeCloseTo(1.5, 12);
    expect(() => lossRatePercentPerWeek(3, 0)).toThrow(RangeError);
  });

  it('works out each weigh-in against the previous one and the green weight', () => {
    // A 2.000 kg green wheel weighed weekly (entered out of order on purpose).
    const series = moistureLossSeries([
      { at: '2024-05-15T09:00:00Z', kg: 1.8 },
      { at: '2024-05-01T09:00:00Z', kg: 2.0 },
      { at: '2024-05-08T09:00:00Z', kg: 1.9 },
    ]);
    expect(series.map((p) => p.days)).toEqual([0, 7, 14]);
    expect(series[0]).toMatchObject({
      lossSinceGreenPercent: 0,
      ratePercentPerWeek: null,
      averageRatePercentPerWeek: null,
    });
    expect(series[1].lossSincePreviousPercent).toBeCloseTo(5, 10);
    expect(series[1].ratePercentPerWeek).toBeCloseTo(5, 10);
    expect(series[2].lossSincePreviousPercent).toBeCloseTo((0.1 / 1.9) * 100, 10);
    expect(series[2].lossSinceGreenPercent).toBeCloseTo(10, 10);
    expect(series[2].averageRatePercentPerWeek).toBeCloseTo(5, 10);
    expect(moistureLossSeries([])).toEqual([]);
  });
});
