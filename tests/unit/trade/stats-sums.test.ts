import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  linearRegression,
  linearRegressionFromSums,
  regressionSums,
} from '../../../shared/trade/stats';

// linearRegressionFromSums must agree with linearRegression (checked against NIST's Norris
// values in stats.test.ts) wherever both apply.
describe('linearRegressionFromSums', () => {
  it('matches the point-by-point fit on random data', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.tuple(
            fc.integer({ min: 0, max: 1000 }).map((v) => v / 100),
            fc.integer({ min: 1, max: 9 }),
          ),
          { minLength: 3, maxLength: 200 },
        ),
        (points) => {
          const xs = points.map((p) => p[0]);
          const ys = points.map((p) => p[1]);
          const a = linearRegression(xs, ys);
          const b = linearRegressionFromSums(regressionSums(xs, ys));
          expect(b.n).toBe(a.n);
          expect(b.reason === null).toBe(a.reason === null);
          if (!a.fit || !b.fit) return;
          const close = (p: number, q: number) =>
            expect(Math.abs(p - q)).toBeLessThanOrEqual(1e-6 * Math.max(1, Math.abs(p)));
          close(b.fit.slope, a.fit.slope);
          close(b.fit.intercept, a.fit.intercept);
          close(b.fit.slopeStandardError, a.fit.slopeStandardError);
          close(b.fit.slopeConfidenceInterval95[0], a.fit.slopeConfidenceInterval95[0]);
          if (a.fit.r !== null && b.fit.r !== null) close(b.fit.r, a.fit.r);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('says when there are too few points or no spread in x', () => {
    expect(linearRegressionFromSums(regressionSums([1, 2], [3, 4])).reason).toBe('too-few-points');
    expect(linearRegressionFromSums(regressionSums([2, 2, 2], [3, 4, 5])).reason).toBe(
      'no-spread-in-x',
    );
  });
});
