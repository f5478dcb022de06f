// Whether to warn the maker that the heat is coming up too fast. The arithmetic is the
// shared trade library's (checkHeatingRamp, currentRampRate: rise per 5 minutes over windows
// of at least 5 minutes); this module only decides which readings count and what the page
// says: the readings of the current step, while the milk is warmed or the curd cooked.

import type { StepKind } from '@shared/constants/journal';
import { checkHeatingRamp, currentRampRate, DEFAULT_RAMP_LIMIT_C_PER_5_MIN } from '@shared/trade';

/** Steps where the maker raises the temperature and the ramp is watched. */
export const RAMP_STEP_KINDS: readonly StepKind[] = ['warming', 'cooking'];

/**
 * Readings closer together than this give no rate yet, minutes: a thermometer wobbling by
 * 0.2 °C between two taps 20 s apart would otherwise read as a runaway ramp (our choice).
 */
export const RAMP_MIN_SPAN_MINUTES = 1;

export interface RampReading {
  takenAt: string;
  tempC: number | null;
  stepIndex: number | null;
}

export type RampLevel = 'off' | 'waiting' | 'ok' | 'too-fast';

export interface RampDecision {
  level: RampLevel;
  /** the latest rate, °C per 5 min (rises positive), once there is one */
  rateCPer5Min: number | null;
  /** the fastest rise of this step so far, °C per 5 min */
  fastestCPer5Min: number | null;
  limitCPer5Min: number;
  /** the rate ran over the limit earlier in the step even if it is fine now */
  exceededEarlier: boolean;
  /** temperature readings of the step */
  count: number;
}

export interface RampDecisionOptions {
  stepIndex: number | null;
  stepKind: StepKind | null;
  limitCPer5Min?: number;
  minSpanMinutes?: number;
}

/** True when the step is one where the heat is raised (warming, cooking). */
export function rampApplies(kind: StepKind | null): boolean {
  return kind !== null && RAMP_STEP_KINDS.includes(kind);
}

/** Decides the ramp warning for the current step from its readings (see the file note). */
export function decideRamp(
  readings: readonly RampReading[],
  options: RampDecisionOptions,
): RampDecision {
  const limit = options.limitCPer5Min ?? DEFAULT_RAMP_LIMIT_C_PER_5_MIN;
  const none: RampDecision = {
    level: 'off',
    rateCPer5Min: null,
    fastestCPer5Min: null,
    limitCPer5Min: limit,
    exceededEarlier: false,
    count: 0,
  };
  if (options.stepIndex === null || !rampApplies(options.stepKind)) return none;
  const points = readings
    .filter((r) => r.stepIndex === options.stepIndex && r.tempC !== null)
    .map((r) => ({ at: r.takenAt, tempC: r.tempC as number }));
  const times = points.map((p) => Date.parse(p.at));
  const spanMinutes = points.length ? (Math.max(...times) - Math.min(...times)) / 60_000 : 0;
  if (points.length < 2 || spanMinutes < (options.minSpanMinutes ?? RAMP_MIN_SPAN_MINUTES)) {
    return { ...none, level: 'waiting', count: points.length };
  }
  const check = checkHeatingRamp(points, { limitCPer5Min: limit });
  const rate = currentRampRate(points);
  // The same tolerance the library uses, so a ramp planned at the limit is not flagged.
  const tooFast = rate !== null && rate > limit * (1 + 1e-9);
  return {
    level: tooFast ? 'too-fast' : 'ok',
    rateCPer5Min: rate,
    fastestCPer5Min: check.fastest?.ratePer5MinC ?? null,
    limitCPer5Min: limit,
    exceededEarlier: !check.withinLimit && !tooFast,
    count: points.length,
  };
}
