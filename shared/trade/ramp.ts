// Heating-ramp checks for cooking the curd. Makers are told to raise the temperature slowly,
// commonly no faster than about 2 °F (1.1 °C) per 5 minutes (common practice, no published
// source).
//
// How rates are made comparable when readings come at uneven intervals: a rate is always
// the rise between two readings divided by the time between them, scaled to 5 minutes
// (ΔT / Δt × 5 min). Readings 5 minutes or more apart are taken pair by pair. Readings
// closer than that are not compared with their immediate neighbour, which would turn a
// 0.2 °C wobble of the thermometer over 30 seconds into "2 °C per 5 minutes"; instead each
// window runs from a reading to the first reading at least 5 minutes later (the window),
// and the last window ends at the last reading and starts at least 5 minutes before it. If
// all readings span less than one window, the whole span is used. Every stretch of the
// cook is therefore covered by windows of at least 5 minutes.

import { toEpochMs } from './time';
import type { TimeInput } from './time';

/** A timed temperature reading of the vat. */
export interface TemperatureReading {
  at: TimeInput;
  tempC: number;
}

/** 2 °F per 5 minutes expressed in °C per 5 minutes (10/9 ≈ 1.111; common practice). */
export const DEFAULT_RAMP_LIMIT_C_PER_5_MIN = 2 / 1.8;

/** Shortest span a rate is measured over, minutes (see the note at the top of this file). */
export const DEFAULT_RAMP_WINDOW_MINUTES = 5;

const MS_PER_5_MIN = 5 * 60_000;

export interface RampSegment {
  startMs: number;
  endMs: number;
  minutes: number;
  fromC: number;
  toC: number;
  riseC: number;
  /** rise over the segment scaled to 5 minutes, °C per 5 min */
  ratePer5MinC: number;
}

export interface RampOptions {
  /** limit in °C per 5 minutes; default 2 °F per 5 min */
  limitCPer5Min?: number;
  /** shortest span for a rate, minutes; default 5 */
  windowMinutes?: number;
}

interface Point {
  ms: number;
  c: number;
}

// Sorted by time; readings at the same instant (two thermometers, a double tap) are averaged.
function normalise(readings: readonly TemperatureReading[]): Point[] {
  const points = readings
    .map((r) => {
      if (!Number.isFinite(r.tempC)) throw new RangeError('Temperature must be a finite number');
      return { ms: toEpochMs(r.at), c: r.tempC };
    })
    .sort((a, b) => a.ms - b.ms);
  const merged: { ms: number; sum: number; count: number }[] = [];
  for (const p of points) {
    const last = merged[merged.length - 1];
    if (last && last.ms === p.ms) {
      last.sum += p.c;
      last.count += 1;
    } else {
      merged.push({ ms: p.ms, sum: p.c, count: 1 });
    }
  }
  return merged.map((m) => ({ ms: m.ms, c: m.sum / m.count }));
}

function segment(a: Point, b: Point): RampSegment {
  const riseC = b.c - a.c;
  const spanMs = b.ms - a.ms;
  return {
    startMs: a.ms,
    endMs: b.ms,
    minutes: spanMs / 60_000,
    fromC: a.c,
    toC: b.c,
    riseC,
    ratePer5MinC: (riseC / spanMs) * MS_PER_5_MIN,
  };
}

function windowMs(options: RampOptions): number {
  const minutes = options.windowMinutes ?? DEFAULT_RAMP_WINDOW_MINUTES;
  if (!Number.isFinite(minutes) || minutes <= 0) throw new RangeError('Window must be positive');
  return minutes * 60_000;
}

/** Returns the windows of the cook with their rise and rate in °C per 5 min (method above). */
export function rampSegments(
  readings: readonly TemperatureReading[],
  options: RampOptions = {},
): RampSegment[] {
  const points = normalise(readings);
  const n = points.length;
  if (n < 2) return [];
  const w = windowMs(options);
  const last = points[n - 1];
  if (last.ms - points[0].ms < w) return [segment(points[0], last)];
  const segments: RampSegment[] = [];
  let j = 1;
  for (let i = 0; i < n - 1; i++) {
    if (j <= i) j = i + 1;
    while (j < n && points[j].ms - points[i].ms < w) j++;
    if (j < n) {
      segments.push(segment(points[i], points[j]));
      continue;
    }
    // Too close to the end for a full window: one last window ending at the last reading.
    let k = n - 2;
    while (k > 0 && last.ms - points[k].ms < w) k--;
    const tail = segment(points[k], last);
    const previous = segments[segments.length - 1];
    if (!previous || previous.startMs !== tail.startMs || previous.endMs !== tail.endMs) {
      segments.push(tail);
    }
    break;
  }
  return segments;
}

/** A stretch of the cook where the rise ran faster than the limit. */
export interface RampStretch {
  startMs: number;
  endMs: number;
  /** fastest rate inside the stretch, °C per 5 min */
  maxRatePer5MinC: number;
}

export interface RampCheck {
  segments: RampSegment[];
  /** the window with the fastest rise, or null when the temperature never rose */
  fastest: RampSegment | null;
  /** overlapping windows over the limit, merged into stretches */
  exceeding: RampStretch[];
  limitCPer5Min: number;
  withinLimit: boolean;
}

/** Returns the fastest rise and the stretches over the limit in °C per 5 min (common practice). */
export function checkHeatingRamp(
  readings: readonly TemperatureReading[],
  options: RampOptions = {},
): RampCheck {
  const limit = options.limitCPer5Min ?? DEFAULT_RAMP_LIMIT_C_PER_5_MIN;
  if (!Number.isFinite(limit) || limit <= 0) throw new RangeError('Limit must be positive');
  const segments = rampSegments(readings, options);
  let fastest: RampSegment | null = null;
  for (const s of segments) {
    if (s.riseC > 0 && (!fastest || s.ratePer5MinC > fastest.ratePer5MinC)) fastest = s;
  }
  // A ramp planned at exactly the limit must not be flagged for a rounding error.
  const threshold = limit * (1 + 1e-9);
  const exceeding: RampStretch[] = [];
  for (const s of segments) {
    if (s.ratePer5MinC <= threshold) continue;
    const open = exceeding[exceeding.length - 1];
    if (open && s.startMs <= open.endMs) {
      open.endMs = Math.max(open.endMs, s.endMs);
      open.maxRatePer5MinC = Math.max(open.maxRatePer5MinC, s.ratePer5MinC);
    } else {
      exceeding.push({ startMs: s.startMs, endMs: s.endMs, maxRatePer5MinC: s.ratePer5MinC });
    }
  }
  return {
    segments,
    fastest,
    exceeding,
    limitCPer5Min: limit,
    withinLimit: exceeding.length === 0,
  };
}

/** Returns the latest rate in °C per 5 min, over the last window, or null with under 2 readings. */
export function currentRampRate(
  readings: readonly TemperatureReading[],
  options: RampOptions = {},
): number | null {
  const points = normalise(readings);
  const n = points.length;
  if (n < 2) return null;
  const w = windowMs(options);
  const last = points[n - 1];
  let k = n - 2;
  while (k > 0 && last.ms - points[k].ms < w) k--;
  return segment(points[k], last).ratePer5MinC;
}
