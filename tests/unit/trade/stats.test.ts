import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import {
  MIN_MEANINGFUL_N,
  correlation,
  groupSummaries,
  linearRegression,
  mean,
  median,
  quartiles,
  standardDeviation,
  summarize,
} from '../../../shared/trade/stats';
import type { LinearFit } from '../../../shared/trade/stats';
import { expectRelClose, readCsvColumns } from './helpers';

// tests/fixtures/anscombe.csv: F. J. Anscombe, "Graphs in Statistical Analysis",
// The American Statistician 27(1), 17-21, 1973.
const anscombe = readCsvColumns('anscombe.csv');
// tests/fixtures/norris.csv: NIST/ITL StRD linear regression dataset "Norris".
const norris = readCsvColumns('norris.csv');

function fitOf(xs: number[], ys: number[]): LinearFit {
  const result = linearRegression(xs, ys);
  expect(result.fit).not.toBeNull();
  return result.fit as LinearFit;
}

describe("regression against Anscombe's quartet (Anscombe 1973)", () => {
  it.each([1, 2, 3, 4])(
    'set %i: intercept 3.00, slope 0.500, r 0.816 to the published precision',
    (set) => {
      // Within one unit of the last published digit. The common r of 0.816 is cut, not
      // rounded, for set IV, whose r is 0.81652 (it rounds to 0.817), hence not ±half a unit.
      const fit = fitOf(anscombe[`x${set}`], anscombe[`y${set}`]);
      expect(Math.abs(fit.intercept - 3.0)).toBeLessThanOrEqual(0.01);
      expect(Math.abs(fit.slope - 0.5)).toBeLessThanOrEqual(0.001);
      expect(Math.abs(fit.r! - 0.816)).toBeLessThanOrEqual(0.001);
      const r = correlation(anscombe[`x${set}`], anscombe[`y${set}`])!;
      expect(Math.abs(r - 0.816)).toBeLessThanOrEqual(0.001);
      // and the line rounds to the published y = 3.00 + 0.500 x
      expect(fit.intercept.toFixed(2)).toBe('3.00');
      expect(fit.slope.toFixed(3)).toBe('0.500');
    },
  );

  it('set I precisely: intercept 3.0000909, slope 0.5000909, r 0.8164205 (Anscombe 1973)', () => {
    const fit = fitOf(anscombe.x1, anscombe.y1);
    expect(fit.intercept).toBeCloseTo(3.0000909, 7);
    expect(fit.slope).toBeCloseTo(0.5000909, 7);
    expect(fit.r!).toBeCloseTo(0.8164205, 7);
  });

  it("set I: the paper's table of sums of squares, standard error 0.118 and R² 0.667 [memory]", () => {
    // Anscombe 1973, table common to all four sets [memory for these figures]:
    // Σ(x − x̄)² 110.0, residual sum of squares 13.75 on 9 d.f., SE of slope 0.118, R² 0.667.
    const fit = fitOf(anscombe.x1, anscombe.y1);
    expect(fit.degreesOfFreedom).toBe(9);
    expect(fit.residualSumOfSquares).toBeCloseTo(13.75, 1);
    expect(fit.slopeStandardError).toBeCloseTo(0.118, 3);
    expect(fit.rSquared!).toBeCloseTo(0.667, 2);
  });

  it("95 % interval of the slope uses Student's t(0.975, 9) = 2.262 (t table, NIST/SEMATECH e-Handbook 1.3.6.7.2)", () => {
    const fit = fitOf(anscombe.x1, anscombe.y1);
    expect(fit.tCritical95).toBeCloseTo(2.262, 3);
    const [lo, hi] = fit.slopeConfidenceInterval95;
    expect(lo).toBeCloseTo(fit.slope - 2.262 * fit.slopeStandardError, 3);
    expect(hi).toBeCloseTo(fit.slope + 2.262 * fit.slopeStandardError, 3);
    expect(lo).toBeLessThan(0.5000909);
    expect(hi).toBeGreaterThan(0.5000909);
  });
});

describe('regression against the NIST StRD "Norris" certified values', () => {
  // NIST/ITL Statistical Reference Datasets, linear least squares, "Norris", certified values.
  const CERTIFIED = {
    intercept: -0.262323073774029,
    interceptSd: 0.232818234301152,
    slope: 1.00211681802045,
    slopeSd: 0.429796848199937e-3,
    residualSd: 0.884796396144373,
    rSquared: 0.999993745883712,
    residualSumOfSquares: 26.6173985294224,
  };
  // At least 9 significant digits: relative error below 1e-9.
  const NINE_DIGITS = 1e-9;

  it('has the 36 certified observations', () => {
    expect(norris.x).toHaveLength(36);
    expect(norris.y).toHaveLength(36);
  });

  it('matches intercept, slope, R², both standard errors and residual sd to 9+ digits (NIST StRD)', () => {
    const result = linearRegression(norris.x, norris.y);
    expect(result.meaningful).toBe(true);
    const fit = result.fit as LinearFit;
    expectRelClose(fit.intercept, CERTIFIED.intercept, NINE_DIGITS);
    expectRelClose(fit.slope, CERTIFIED.slope, NINE_DIGITS);
    expectRelClose(fit.rSquared!, CERTIFIED.rSquared, NINE_DIGITS);
    expectRelClose(fit.interceptStandardError, CERTIFIED.interceptSd, NINE_DIGITS);
    expectRelClose(fit.slopeStandardError, CERTIFIED.slopeSd, NINE_DIGITS);
    expectRelClose(fit.residualStandardDeviation, CERTIFIED.residualSd, NINE_DIGITS);
    expectRelClose(fit.residualSumOfSquares, CERTIFIED.residualSumOfSquares, NINE_DIGITS);
    expect(fit.degreesOfFreedom).toBe(34);
    // t(0.975, 34) = 2.032 (t table, NIST/SEMATECH e-Handbook 1.3.6.7.2)
    expect(fit.tCritical95).toBeCloseTo(2.032, 3);
  });

  it("reads jstat's swapped labels right: its SSR is the residual sum, its SSE the explained sum (TRADE.md)", () => {
    const model = jStat.models.ols(
      norris.y,
      norris.x.map((x) => [1, x]),
    );
    expectRelClose(model.SSR, CERTIFIED.residualSumOfSquares, NINE_DIGITS);
    // The explained sum is R² × total; here the total is the explained plus the residual sum.
    expectRelClose(model.SSE / (model.SSE + model.SSR), CERTIFIED.rSquared, NINE_DIGITS);
  });

  it('agrees with the textbook standard error sqrt(Σe²/(n−2)) / sqrt(Σ(x−x̄)²) (TRADE.md)', () => {
    const fit = fitOf(norris.x, norris.y);
    const n = norris.x.length;
    const xBar = norris.x.reduce((a, b) => a + b, 0) / n;
    const sxx = norris.x.reduce((a, x) => a + (x - xBar) ** 2, 0);
    const rss = norris.x.reduce(
      (a, x, i) => a + (norris.y[i] - (fit.intercept + fit.slope * x)) ** 2,
      0,
    );
    expectRelClose(fit.slopeStandardError, Math.sqrt(rss / (n - 2)) / Math.sqrt(sxx), 1e-9);
  });
});

describe('regression edge cases', () => {
  it(`flags fewer than ${MIN_MEANINGFUL_N} points as not meaningful but still fits from 3`, () => {
    const four = linearRegression([1, 2, 3, 4], [2, 4.1, 5.9, 8.2]);
    expect(four).toMatchObject({ n: 4, meaningful: false, reason: 'too-few-points' });
    expect(four.fit!.slope).toBeCloseTo(2.04, 10);
    const five = linearRegression([1, 2, 3, 4, 5], [2, 4.1, 5.9, 8.2, 9.9]);
    expect(five).toMatchObject({ n: 5, meaningful: true, reason: null });
  });

  it('gives no fit below 3 points or when every x is the same', () => {
    expect(linearRegression([1, 2], [3, 4])).toEqual({
      n: 2,
      meaningful: false,
      reason: 'too-few-points',
      fit: null,
    });
    expect(linearRegression([7, 7, 7, 7, 7], [1, 2, 3, 4, 5])).toMatchObject({
      meaningful: false,
      reason: 'no-spread-in-x',
      fit: null,
    });
  });

  it('reports r as null when y has no spread; a perfect line has zero standard error', () => {
    const flat = fitOf([1, 2, 3, 4, 5], [3, 3, 3, 3, 3]);
    expect(flat.slope).toBe(0);
    expect(flat.r).toBeNull();
    const exact = fitOf([1, 2, 3, 4, 5], [1, 3, 5, 7, 9]);
    expect(exact.slope).toBeCloseTo(2, 12);
    expect(exact.rSquared!).toBeCloseTo(1, 12);
    expect(exact.slopeStandardError).toBeCloseTo(0, 12);
  });

  it('rejects mismatched lengths and non-numbers', () => {
    expect(() => linearRegression([1, 2, 3], [1, 2])).toThrow(RangeError);
    expect(() => linearRegression([1, 2, Number.NaN], [1, 2, 3])).toThrow(RangeError);
  });
});

describe('descriptive statistics', () => {
  it('mean of x is 9.0 and Σ(x − x̄)² is 110, so the sample sd is √11 (Anscombe 1973)', () => {
    expect(mean(anscombe.x1)).toBe(9);
    expect(standardDeviation(anscombe.x1)).toBeCloseTo(Math.sqrt(11), 12);
    // mean of y is 7.50 in every set (Anscombe 1973)
    for (const set of [1, 2, 3, 4]) expect(mean(anscombe[`y${set}`])).toBeCloseTo(7.5, 2);
  });

  it("quartiles by Hyndman and Fan (1996) definition 7, R's default quantile(), worked by hand", () => {
    // x of set I is 4..14: positions (n − 1) p = 2.5 and 7.5 give 6.5 and 11.5.
    expect(quartiles(anscombe.x1)).toEqual({ q1: 6.5, median: 9, q3: 11.5 });
    // quantile(1:4) in R gives 1.75, 2.5, 3.25
    expect(quartiles([4, 1, 3, 2])).toEqual({ q1: 1.75, median: 2.5, q3: 3.25 });
    expect(median([5, 1, 3])).toBe(3);
    expect(() => median([])).toThrow(RangeError);
  });

  it('summarises a set with the not-meaningful flag below 5 values', () => {
    const s = summarize([2, 4, 4, 4, 5, 5, 7, 9]);
    expect(s).toMatchObject({ n: 8, mean: 5, median: 4.5, min: 2, max: 9, meaningful: true });
    // sample sd of this textbook set: sqrt(32 / 7)
    expect(s!.standardDeviation).toBeCloseTo(Math.sqrt(32 / 7), 12);
    expect(summarize([3])).toMatchObject({ n: 1, standardDeviation: null, meaningful: false });
    expect(summarize([])).toBeNull();
  });

  it('groups a categorical parameter: Anscombe set IV by x (hand computation from the 1973 data)', () => {
    const groups = groupSummaries(
      anscombe.x4.map((x) => String(x)),
      anscombe.y4,
    );
    expect(groups.map((g) => [g.group, g.n])).toEqual([
      ['8', 10],
      ['19', 1],
    ]);
    expect(groups[0].mean).toBeCloseTo(7.001, 10);
    expect(groups[0].median).toBeCloseTo(6.965, 10);
    expect(groups[0].meaningful).toBe(true);
    expect(groups[1]).toMatchObject({ mean: 12.5, median: 12.5, meaningful: false });
    expect(() => groupSummaries(['a'], [1, 2])).toThrow(RangeError);
  });
});
