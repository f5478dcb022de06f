// Statistics for Compare. The arithmetic comes from two well-known libraries rather than
// being written again here: simple-statistics 7.12.1 (means, quantiles, slope and intercept,
// correlation) and jstat 1.9.6 (ordinary least squares with standard errors; Student's t).
// Checked against Anscombe's quartet and the NIST StRD "Norris" certified values.

import * as ss from 'simple-statistics';
import jStat from 'jstat';
import { CORRELATION_SIZE } from '../constants/compare';

/** Below this many points a figure is still computed but flagged as not meaningful. */
export const MIN_MEANINGFUL_N = 5;

function assertValues(values: readonly number[], what: string): void {
  for (const v of values) {
    if (!Number.isFinite(v)) throw new RangeError(`${what} must all be finite numbers`);
  }
}

function assertNonEmpty(values: readonly number[]): void {
  if (values.length === 0) throw new RangeError('At least one value is needed');
  assertValues(values, 'Values');
}

/** Returns the arithmetic mean, in the values' unit (simple-statistics mean). */
export function mean(values: readonly number[]): number {
  assertNonEmpty(values);
  return ss.mean([...values]);
}

/** Returns the median, in the values' unit (simple-statistics median). */
export function median(values: readonly number[]): number {
  assertNonEmpty(values);
  return ss.median([...values]);
}

/** First quartile, median and third quartile. */
export interface Quartiles {
  q1: number;
  median: number;
  q3: number;
}

// Linear interpolation between order statistics, R's default quantile() type.
/** Returns Q1, median, Q3 in the values' unit (Hyndman & Fan 1996 def. 7; simple-statistics). */
export function quartiles(values: readonly number[]): Quartiles {
  assertNonEmpty(values);
  const sorted = [...values].sort((a, b) => a - b);
  return {
    q1: ss.quantileSorted(sorted, 0.25),
    median: ss.quantileSorted(sorted, 0.5),
    q3: ss.quantileSorted(sorted, 0.75),
  };
}

/** Returns the sample standard deviation (n − 1), in the values' unit (simple-statistics). */
export function standardDeviation(values: readonly number[]): number {
  assertValues(values, 'Values');
  if (values.length < 2) throw new RangeError('A standard deviation needs at least two values');
  return ss.sampleStandardDeviation([...values]);
}

/** Descriptive figures for one set of values. */
export interface Summary extends Quartiles {
  n: number;
  mean: number;
  min: number;
  max: number;
  /** sample standard deviation; null with a single value */
  standardDeviation: number | null;
  /** false below MIN_MEANINGFUL_N values */
  meaningful: boolean;
}

/** Returns n, mean, median, quartiles, min, max and sample sd, values' unit (simple-statistics). */
export function summarize(values: readonly number[]): Summary | null {
  if (values.length === 0) return null;
  assertValues(values, 'Values');
  const q = quartiles(values);
  return {
    n: values.length,
    mean: mean(values),
    ...q,
    min: ss.min([...values]),
    max: ss.max([...values]),
    standardDeviation: values.length >= 2 ? standardDeviation(values) : null,
    meaningful: values.length >= MIN_MEANINGFUL_N,
  };
}

/** Summary of the outcome for one value of a categorical parameter. */
export interface GroupSummary<K> extends Summary {
  group: K;
}

/** Returns a summary of y for each distinct x, in order of first appearance (simple-statistics). */
export function groupSummaries<K extends string | number | boolean>(
  xs: readonly K[],
  ys: readonly number[],
): GroupSummary<K>[] {
  if (xs.length !== ys.length) throw new RangeError('x and y must have the same length');
  assertValues(ys, 'Outcome values');
  const groups = new Map<K, number[]>();
  xs.forEach((x, i) => {
    const bucket = groups.get(x);
    if (bucket) bucket.push(ys[i]);
    else groups.set(x, [ys[i]]);
  });
  return [...groups].map(([group, values]) => ({ group, ...(summarize(values) as Summary) }));
}

/** Returns Pearson's r, dimensionless, or null without spread (simple-statistics). */
export function correlation(xs: readonly number[], ys: readonly number[]): number | null {
  if (xs.length !== ys.length) throw new RangeError('x and y must have the same length');
  assertValues(xs, 'x values');
  assertValues(ys, 'y values');
  if (xs.length < 2) return null;
  const r = ss.sampleCorrelation([...xs], [...ys]);
  // Undefined when x or y has no spread.
  return Number.isFinite(r) ? r : null;
}

/** A fitted straight line y = intercept + slope · x with its uncertainty. */
export interface LinearFit {
  /** y units per x unit */
  slope: number;
  /** y units */
  intercept: number;
  /** Pearson's r; null when y has no spread */
  r: number | null;
  rSquared: number | null;
  slopeStandardError: number;
  interceptStandardError: number;
  /** sqrt(residual sum of squares / (n − 2)), y units */
  residualStandardDeviation: number;
  residualSumOfSquares: number;
  degreesOfFreedom: number;
  /** Student's t for a two-sided 95 % interval at n − 2 degrees of freedom */
  tCritical95: number;
  slopeConfidenceInterval95: [number, number];
}

export type NotMeaningfulReason = 'too-few-points' | 'no-spread-in-x';

export interface RegressionResult {
  n: number;
  /** false below MIN_MEANINGFUL_N points or when no line can be fitted */
  meaningful: boolean;
  reason: NotMeaningfulReason | null;
  /** null with fewer than 3 points (no uncertainty) or when every x is the same */
  fit: LinearFit | null;
}

// Slope, intercept and r from simple-statistics; standard errors from jstat's ols; the 95 %
// interval of the slope with Student's t from jstat.
/** Returns the y-on-x least-squares fit, r², SEs, 95 % slope CI (simple-statistics; jstat). */
export function linearRegression(xs: readonly number[], ys: readonly number[]): RegressionResult {
  if (xs.length !== ys.length) throw new RangeError('x and y must have the same length');
  assertValues(xs, 'x values');
  assertValues(ys, 'y values');
  const n = xs.length;
  if (n < 3) return { n, meaningful: false, reason: 'too-few-points', fit: null };
  if (xs.every((x) => x === xs[0])) {
    return { n, meaningful: false, reason: 'no-spread-in-x', fit: null };
  }

  const { m: slope, b: intercept } = ss.linearRegression(xs.map((x, i) => [x, ys[i]]));
  const r = correlation(xs, ys);

  // jstat's ols names its sums of squares the other way round from most textbooks: its
  // `SSR` is the residual sum Σ(y − ŷ)² and its `SSE` the explained sum Σ(ŷ − ȳ)². The
  // standard errors in `t.se` follow the columns of the design matrix: [intercept, slope].
  const model = jStat.models.ols(
    [...ys],
    xs.map((x) => [1, x]),
  );
  const degreesOfFreedom = n - 2;
  const residualSumOfSquares = model.SSR;
  const [interceptStandardError, slopeStandardError] = model.t.se;
  const tCritical95 = jStat.studentt.inv(0.975, degreesOfFreedom);
  const halfWidth = tCritical95 * slopeStandardError;

  const meaningful = n >= MIN_MEANINGFUL_N;
  return {
    n,
    meaningful,
    reason: meaningful ? null : 'too-few-points',
    fit: {
      slope,
      intercept,
      r,
      rSquared: r === null ? null : r * r,
      slopeStandardError,
      interceptStandardError,
      residualStandardDeviation: model.t.sigmaHat,
      residualSumOfSquares,
      degreesOfFreedom,
      tCritical95,
      slopeConfidenceInterval95: [slope - halfWidth, slope + halfWidth],
    },
  };
}

/** The sufficient statistics of a straight-line fit: counts and sums, as SQL can add them up. */
export interface RegressionSums {
  n: number;
  sumX: number;
  sumY: number;
  sumXX: number;
  sumXY: number;
  sumYY: number;
  minX: number;
  maxX: number;
}

// The same least-squares line, r and standard errors as linearRegression, from sums instead
// of the points (textbook formulas: Sxx = Σx² − (Σx)²/n, slope = Sxy/Sxx, SE = s/√Sxx); used
// when the points are too many to fetch. Student's t from jstat.
/** Returns the y-on-x fit from sums (same result as linearRegression on the points). */
export function linearRegressionFromSums(sums: RegressionSums): RegressionResult {
  const { n } = sums;
  if (n < 3) return { n, meaningful: false, reason: 'too-few-points', fit: null };
  const sxx = sums.sumXX - (sums.sumX * sums.sumX) / n;
  if (sums.minX === sums.maxX || !(sxx > 0)) {
    return { n, meaningful: false, reason: 'no-spread-in-x', fit: null };
  }
  const meanX = sums.sumX / n;
  const meanY = sums.sumY / n;
  const sxy = sums.sumXY - (sums.sumX * sums.sumY) / n;
  const syy = Math.max(0, sums.sumYY - (sums.sumY * sums.sumY) / n);
  const slope = sxy / sxx;
  const intercept = meanY - slope * meanX;
  const r = syy > 0 ? Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy))) : null;
  const degreesOfFreedom = n - 2;
  const residualSumOfSquares = Math.max(0, syy - slope * sxy);
  const residualStandardDeviation = Math.sqrt(residualSumOfSquares / degreesOfFreedom);
  const slopeStandardError = residualStandardDeviation / Math.sqrt(sxx);
  const interceptStandardError =
    residualStandardDeviation * Math.sqrt(1 / n + (meanX * meanX) / sxx);
  const tCritical95 = jStat.studentt.inv(0.975, degreesOfFreedom);
  const halfWidth = tCritical95 * slopeStandardError;
  const meaningful = n >= MIN_MEANINGFUL_N;
  return {
    n,
    meaningful,
    reason: meaningful ? null : 'too-few-points',
    fit: {
      slope,
      intercept,
      r,
      rSquared: r === null ? null : r * r,
      slopeStandardError,
      interceptStandardError,
      residualStandardDeviation,
      residualSumOfSquares,
      degreesOfFreedom,
      tCritical95,
      slopeConfidenceInterval95: [slope - halfWidth, slope + halfWidth],
    },
  };
}

/** Adds up the regression sums of some points (to check and to combine with SQL's). */
export function regressionSums(xs: readonly number[], ys: readonly number[]): RegressionSums {
  let sumX = 0;
  let sumY = 0;
  let sumXX = 0;
  let sumXY = 0;
  let sumYY = 0;
  xs.forEach((x, i) => {
    const y = ys[i];
    sumX += x;
    sumY += y;
    sumXX += x * x;
    sumXY += x * y;
    sumYY += y * y;
  });
  return {
    n: xs.length,
    sumX,
    sumY,
    sumXX,
    sumXY,
    sumYY,
    minX: xs.length ? Math.min(...xs) : 0,
    maxX: xs.length ? Math.max(...xs) : 0,
  };
}

/** The size of a correlation in Cohen's conventional words (see CORRELATION_SIZE). */
export type CorrelationSize = 'below small' | 'small' | 'medium' | 'large';

// Thresholds from Cohen (1988), §3.2, kept in shared/constants/compare.ts beside the citation.
/** Returns the size word for |r| by Cohen's 0.1 / 0.3 / 0.5 (Cohen 1988, §3.2). */
export function correlationSize(r: number): CorrelationSize {
  if (!Number.isFinite(r)) throw new RangeError('r must be a finite number');
  const a = Math.abs(r);
  if (a >= CORRELATION_SIZE.large) return 'large';
  if (a >= CORRELATION_SIZE.medium) return 'medium';
  if (a >= CORRELATION_SIZE.small) return 'small';
  return 'below small';
}
