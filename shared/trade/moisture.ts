// Moisture loss while a wheel dries and ages, from its weigh-ins. The first weigh-in (or a
// given green weight) is the green cheese just out of the press.

import { MS_PER_DAY, toEpochMs } from './time';
import type { TimeInput } from './time';

/** One weighing of a wheel. */
export interface WeighIn {
  at: TimeInput;
  kg: number;
}

function assertMass(kg: number, what: string): void {
  if (!Number.isFinite(kg) || kg <= 0) throw new RangeError(`${what} must be a positive mass`);
}

/** Returns the mass lost from one weight to a later one as % of the earlier weight (definition). */
export function massLossPercent(fromKg: number, toKg: number): number {
  assertMass(fromKg, 'Earlier weight');
  if (!Number.isFinite(toKg) || toKg < 0) throw new RangeError('Later weight must be non-negative');
  return ((fromKg - toKg) / fromKg) * 100;
}

/** Returns a loss rate in % per week from a loss in % over a number of days (definition). */
export function lossRatePercentPerWeek(lossPercent: number, days: number): number {
  if (!Number.isFinite(lossPercent)) throw new RangeError('Loss must be a finite number');
  if (!Number.isFinite(days) || days <= 0) throw new RangeError('Days must be positive');
  return (lossPercent / days) * 7;
}

/** One weigh-in with the losses worked out. */
export interface MoistureLossPoint {
  atMs: number;
  kg: number;
  /** days since the green weight */
  days: number;
  /** % of the previous weight lost since the previous weigh-in (0 for the first) */
  lossSincePreviousPercent: number;
  /** % of the green weight lost since the green weight */
  lossSinceGreenPercent: number;
  /** loss since the previous weigh-in, % of that weight per week (null for the first) */
  ratePercentPerWeek: number | null;
  /** average loss since green, % of green weight per week (null for the first) */
  averageRatePercentPerWeek: number | null;
}

/** Returns the weigh-ins in time order with loss since previous and since green (%, %/week). */
export function moistureLossSeries(weighIns: readonly WeighIn[]): MoistureLossPoint[] {
  const sorted = weighIns
    .map((w) => {
      assertMass(w.kg, 'Weight');
      return { atMs: toEpochMs(w.at), kg: w.kg };
    })
    .sort((a, b) => a.atMs - b.atMs);
  if (sorted.length === 0) return [];
  const green = sorted[0];
  return sorted.map((w, i) => {
    const days = (w.atMs - green.atMs) / MS_PER_DAY;
    if (i === 0) {
      return {
        ...w,
        days,
        lossSincePreviousPercent: 0,
        lossSinceGreenPercent: 0,
        ratePercentPerWeek: null,
        averageRatePercentPerWeek: null,
      };
    }
    const previous = sorted[i - 1];
    const stepDays = (w.atMs - previous.atMs) / MS_PER_DAY;
    const lossSincePreviousPercent = massLossPercent(previous.kg, w.kg);
    const lossSinceGreenPercent = massLossPercent(green.kg, w.kg);
    return {
      ...w,
      days,
      lossSincePreviousPercent,
      lossSinceGreenPercent,
      ratePercentPerWeek:
        stepDays > 0 ? lossRatePercentPerWeek(lossSincePreviousPercent, stepDays) : null,
      averageRatePercentPerWeek:
        days > 0 ? lossRatePercentPerWeek(lossSinceGreenPercent, days) : null,
    };
  });
}

/** Above this gain over the last weigh-in a wheel is called heavier (scale noise, fraction). */
export const WEIGH_IN_GAIN_TOLERANCE = 0.01;
/**
 * Most a wheel is taken to lose per day between weigh-ins before we ask (fraction of the last
 * weight per day), and at most in one step whatever the gap. Common practice, no published
 * source: young natural-rind wheels lose roughly 0.5-1 % a day at first, less later [memory].
 */
export const WEIGH_IN_MAX_LOSS_PER_DAY = 0.02;
export const WEIGH_IN_MAX_LOSS_AT_ONCE = 0.3;

export interface WeighInDoubt {
  kind: 'heavier' | 'too-light';
  /** change against the last weigh-in, percent (positive for a gain, negative for a loss) */
  changePercent: number;
  /** days since the last weigh-in (0 for the same day) */
  days: number;
}

/**
 * Returns why a new weigh-in looks wrong against the last one, or null: heavier than it
 * (wheels lose water as they age), or lighter by more than wheels lose in that time
 * (percent and days; the thresholds above are common practice, no published source).
 */
export function weighInDoubt(
  last: { date: string; massKg: number } | null,
  next: { date: string; massKg: number },
): WeighInDoubt | null {
  if (!last || !(last.massKg > 0) || !(next.massKg > 0)) return null;
  const days = Math.round((toEpochMs(next.date) - toEpochMs(last.date)) / MS_PER_DAY);
  if (days < 0) return null; // a back-dated weigh-in: no "last" to compare with
  const change = (next.massKg - last.massKg) / last.massKg;
  const changePercent = Math.round(change * 1000) / 10;
  if (change > WEIGH_IN_GAIN_TOLERANCE) return { kind: 'heavier', changePercent, days };
  const loss = -change;
  if (loss > WEIGH_IN_MAX_LOSS_AT_ONCE || loss > WEIGH_IN_MAX_LOSS_PER_DAY * Math.max(days, 1))
    return { kind: 'too-light', changePercent, days };
  return null;
}
