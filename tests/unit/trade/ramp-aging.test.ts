import { describe, expect, it } from 'vitest';
import {
  RAW_MILK_MIN_AGING_DAYS,
  RAW_MILK_MIN_AGING_TEMP_C,
  ageInDays,
  daysToTarget,
  openedOnAfter,
  rawMilkCaution,
  rawMilkReadyCheck,
  readyDate,
  wheelAgeDays,
} from '../../../shared/trade/aging';
import { weighInDoubt } from '../../../shared/trade/moisture';
import {
  DEFAULT_RAMP_LIMIT_C_PER_5_MIN,
  checkHeatingRamp,
  currentRampRate,
  rampSegments,
} from '../../../shared/trade/ramp';
import {
  CHEDDAR_STANDARD,
  checkCheddarStandard,
  fatInDryMatterPercent,
} from '../../../shared/trade/standards';
import {
  calendarDateOf,
  dateOfDayNumber,
  dayNumber,
  isoDate,
  minutesBetween,
  toEpochMs,
} from '../../../shared/trade/time';
import { deltaFromCelsius, toCelsius } from '../../../shared/trade/units';

const start = Date.parse('2024-06-01T10:00:00Z');
const at = (minutes: number): number => start + minutes * 60_000;

/** Readings every `step` minutes of a straight rise from `fromF` to `toF` over `minutes`. */
function linearRamp(fromF: number, toF: number, minutes: number, step: number) {
  const readings = [];
  for (let m = 0; m <= minutes + 1e-9; m += step) {
    readings.push({ at: at(m), tempC: toCelsius(fromF + ((toF - fromF) * m) / minutes, 'F') });
  }
  return readings;
}

describe('heating ramp', () => {
  // Limit: about 2 °F per 5 minutes when cooking curd (common practice, no published source).
  it('the default limit is 2 °F per 5 min, about 1.111 °C (common practice, no published source)', () => {
    expect(DEFAULT_RAMP_LIMIT_C_PER_5_MIN).toBeCloseTo(1.1111, 4);
    expect(deltaFromCelsius(DEFAULT_RAMP_LIMIT_C_PER_5_MIN, 'F')).toBeCloseTo(2, 12);
  });

  it('85 °F to 100 °F in 30 minutes averages 2.5 °F per 5 min, over the limit (common practice, no published source)', () => {
    const readings = [
      { at: at(0), tempC: toCelsius(85, 'F') },
      { at: at(30), tempC: toCelsius(100, 'F') },
    ];
    const check = checkHeatingRamp(readings);
    expect(deltaFromCelsius(check.fastest!.ratePer5MinC, 'F')).toBeCloseTo(2.5, 12);
    expect(check.withinLimit).toBe(false);
    expect(check.exceeding).toHaveLength(1);
  });

  it('the same rise over 40 minutes is within the limit (common practice, no published source)', () => {
    const readings = [
      { at: at(0), tempC: toCelsius(85, 'F') },
      { at: at(40), tempC: toCelsius(100, 'F') },
    ];
    const check = checkHeatingRamp(readings);
    expect(deltaFromCelsius(check.fastest!.ratePer5MinC, 'F')).toBeCloseTo(1.875, 12);
    expect(check.withinLimit).toBe(true);
    expect(check.exceeding).toEqual([]);
  });

  it('gives the same rate whatever the sampling interval (30 s, 1, 5 or 10 min)', () => {
    for (const step of [0.5, 1, 5, 10]) {
      const check = checkHeatingRamp(linearRamp(85, 100, 30, step));
      expect(deltaFromCelsius(check.fastest!.ratePer5MinC, 'F')).toBeCloseTo(2.5, 9);
      expect(check.withinLimit).toBe(false);
      const slow = checkHeatingRamp(linearRamp(85, 100, 40, step));
      expect(slow.withinLimit).toBe(true);
    }
  });

  it('does not flag a thermometer wobble between readings seconds apart', () => {
    // A steady 1 °F per 5 min with ±0.3 °F (±0.3/1.8 °C) reading noise every 30 seconds.
    const readings = linearRamp(88, 94, 30, 0.5).map((r, i) => ({
      ...r,
      tempC: r.tempC + (i % 2 === 0 ? 0.3 : -0.3) / 1.8,
    }));
    const check = checkHeatingRamp(readings);
    expect(check.withinLimit).toBe(true);
    for (const s of check.segments) expect(s.minutes).toBeGreaterThanOrEqual(5);
    // Pair by pair (a 30-second window) the same readings would look like 7 °F per 5 min.
    const naive = checkHeatingRamp(readings, { windowMinutes: 0.5 });
    expect(naive.withinLimit).toBe(false);
    expect(deltaFromCelsius(naive.fastest!.ratePer5MinC, 'F')).toBeCloseTo(7, 9);
  });

  it('finds a fast stretch inside a slow cook, with uneven sampling', () => {
    const f = (m: number, tempF: number) => ({ at: at(m), tempC: toCelsius(tempF, 'F') });
    const readings = [f(0, 86), f(10, 88), f(17, 89), f(20, 92), f(25, 95), f(35, 96), f(45, 97)];
    const check = checkHeatingRamp(readings);
    expect(check.withinLimit).toBe(false);
    expect(check.exceeding).toHaveLength(1);
    const [stretch] = check.exceeding;
    expect(stretch.startMs).toBeGreaterThanOrEqual(at(10));
    expect(stretch.endMs).toBeLessThanOrEqual(at(35));
    // 89 → 95 °F between minutes 17 and 25 is 3.75 °F per 5 min
    expect(deltaFromCelsius(check.fastest!.ratePer5MinC, 'F')).toBeCloseTo(3.75, 9);
    // covered to the last reading
    expect(check.segments[check.segments.length - 1].endMs).toBe(at(45));
  });

  it('covers the tail when the last readings are close together', () => {
    const f = (m: number, tempF: number) => ({ at: at(m), tempC: toCelsius(tempF, 'F') });
    const segments = rampSegments([f(0, 86), f(5, 87), f(10, 88), f(12, 91)]);
    expect(segments.map((s) => [s.startMs, s.endMs])).toEqual([
      [at(0), at(5)],
      [at(5), at(10)],
      [at(5), at(12)],
    ]);
  });

  it('accepts Date, ISO string and epoch ms; a custom limit; the current rate', () => {
    const readings = [
      { at: new Date(at(0)), tempC: 31 },
      { at: new Date(at(10)).toISOString(), tempC: 32 },
      { at: at(20), tempC: 34 },
    ];
    expect(checkHeatingRamp(readings).withinLimit).toBe(true);
    expect(checkHeatingRamp(readings, { limitCPer5Min: 0.75 }).withinLimit).toBe(false);
    expect(currentRampRate(readings)).toBeCloseTo(1, 12);
    expect(currentRampRate(readings.slice(0, 1))).toBeNull();
    expect(checkHeatingRamp([]).fastest).toBeNull();
  });
});

describe('aging and the raw-milk caution', () => {
  // Calendar arithmetic, Gregorian calendar: 2024 is a leap year (31 + 29 days to 1 March).
  it('2024-01-01 to 2024-03-01 is 60 days; in 2023 it is 59 (Gregorian leap-year rule)', () => {
    expect(ageInDays('2024-01-01', '2024-03-01')).toBe(60);
    expect(ageInDays('2023-01-01', '2023-03-01')).toBe(59);
    expect(readyDate('2023-01-01', 60)).toBe('2023-03-02');
    expect(readyDate('2024-01-01', 60)).toBe('2024-03-01');
  });

  it('counts calendar days, not 24-hour periods, across a DST change (US DST began 2024-03-10)', () => {
    // 2024-03-09 23:30 to 2024-03-11 00:30 New York time is 24 h but two calendar days.
    const made = '2024-03-10T04:30:00Z'; // 2024-03-09 23:30 EST
    const opened = '2024-03-11T04:30:00Z'; // 2024-03-11 00:30 EDT
    expect(ageInDays(made, opened, 'America/New_York')).toBe(2);
    expect(ageInDays(made, opened)).toBe(1);
    expect(calendarDateOf('2024-03-01', 'America/Los_Angeles')).toEqual({
      year: 2024,
      month: 3,
      day: 1,
    });
    expect(() => calendarDateOf('2024-02-30')).toThrow(RangeError);
  });

  it('days to target go negative once past it (calendar arithmetic)', () => {
    expect(daysToTarget('2024-01-01', 90, '2024-02-01')).toBe(59);
    expect(daysToTarget('2024-01-01', 30, '2024-02-15')).toBe(-15);
    expect(daysToTarget({ year: 2024, month: 1, day: 1 }, 0, '2024-01-01T18:00:00Z')).toBe(0);
  });

  it('flags a raw-milk wheel opened before 60 days, citing 21 CFR 133.113', () => {
    expect(RAW_MILK_MIN_AGING_DAYS).toBe(60);
    const early = rawMilkCaution({ unpasteurised: true, madeOn: '2024-01-01', at: '2024-02-15' });
    expect(early).toMatchObject({ flagged: true, ageDays: 45, daysShort: 15 });
    expect(early.minimumMetOn).toBe('2024-03-01');
    expect(early.message).toMatch(/21 CFR 133\.113/);
    expect(early.message).toMatch(/local rules/i);
    expect(early.source).toMatch(/21 CFR 133\.113/);
  });

  it('states the rule as one for sale, not a safety promise, and who should not eat it (21 CFR 133.113; CDC/FDA)', () => {
    const early = rawMilkCaution({ unpasteurised: true, madeOn: '2024-01-01', at: '2024-02-15' });
    expect(early.message).toMatch(
      /held at least 60 days at no less than 1\.7 °C \(35 °F\) before it is sold/,
    );
    expect(early.message).toMatch(/not a promise that the cheese is safe to eat/);
    expect(early.message).toMatch(
      /pregnant people, young children, older adults and anyone with a weakened immune system/,
    );
  });

  it('finds a raw-milk ready date before the 60-day mark (21 CFR 133.113)', () => {
    expect(
      rawMilkReadyCheck({ heatTreatment: 'raw', madeOn: '2026-12-02', targetDays: 45 }),
    ).toEqual({ minimumMetOn: '2027-01-31', readyBeforeMinimum: true, daysShortAtReady: 15 });
    expect(
      rawMilkReadyCheck({ heatTreatment: 'thermised', madeOn: '2026-12-02', targetDays: 90 }),
    ).toMatchObject({ readyBeforeMinimum: false, daysShortAtReady: 0 });
    expect(
      rawMilkReadyCheck({ heatTreatment: 'pasteurised', madeOn: '2026-12-02', targetDays: 45 }),
    ).toBeNull();
    expect(
      rawMilkReadyCheck({ heatTreatment: 'raw', madeOn: '2026-12-02', targetDays: null }),
    ).toBeNull();
  });

  it('keeps the opening day through opened and finished, clears it back in the cave (common practice, no published source)', () => {
    const inCave = { wheelStatus: 'aging', openedOn: null };
    expect(openedOnAfter(inCave, 'opened', '2026-03-01')).toBe('2026-03-01');
    expect(openedOnAfter(inCave, 'finished', '2026-03-01')).toBe('2026-03-01');
    const opened = { wheelStatus: 'opened', openedOn: '2026-02-01' };
    expect(openedOnAfter(opened, 'finished', '2026-03-01')).toBe('2026-02-01');
    expect(openedOnAfter(opened, 'opened', '2026-03-01')).toBe('2026-02-01');
    expect(openedOnAfter(opened, 'discarded', '2026-03-01')).toBe('2026-02-01');
    expect(openedOnAfter(inCave, 'discarded', '2026-03-01')).toBeNull();
    expect(openedOnAfter(opened, 'aging', '2026-03-01')).toBeNull();
  });

  it('does not flag at 60 days or for pasteurised milk', () => {
    const ripe = rawMilkCaution({ unpasteurised: true, madeOn: '2024-01-01', at: '2024-03-01' });
    expect(ripe).toMatchObject({ flagged: false, daysShort: 0, message: '' });
    const pasteurised = rawMilkCaution({
      unpasteurised: false,
      madeOn: '2024-01-01',
      at: '2024-01-10',
    });
    expect(pasteurised.flagged).toBe(false);
  });
});

describe('cheddar standard of identity (21 CFR 133.113)', () => {
  it('moisture at most 39 %, milkfat at least 50 % of solids, 60 days at 35 °F (21 CFR 133.113)', () => {
    expect(CHEDDAR_STANDARD.maxMoisturePercent).toBe(39);
    expect(CHEDDAR_STANDARD.minFatInDryMatterPercent).toBe(50);
    expect(CHEDDAR_STANDARD.minAgingDaysUnpasteurised).toBe(60);
    expect(RAW_MILK_MIN_AGING_TEMP_C).toBeCloseTo(1.7, 1);
    expect(CHEDDAR_STANDARD.maxCalciumChloridePercentOfMilk).toBe(0.02);
  });

  it('fat in dry matter is fat / (100 − moisture) × 100 (definition of "% of the solids")', () => {
    expect(fatInDryMatterPercent(33, 37)).toBeCloseTo(52.381, 3);
    expect(() => fatInDryMatterPercent(70, 40)).toThrow(RangeError);
  });

  it('checks a cheese against the limits, on both sides of each (21 CFR 133.113)', () => {
    expect(checkCheddarStandard({ moisturePercent: 37, fatPercent: 33 })).toMatchObject({
      moistureWithinLimit: true,
      fatWithinLimit: true,
      meetsStandard: true,
    });
    expect(checkCheddarStandard({ moisturePercent: 39 }).moistureWithinLimit).toBe(true);
    expect(checkCheddarStandard({ moisturePercent: 39.5 }).meetsStandard).toBe(false);
    // 30 % fat at 39 % moisture is 49.2 % of the solids: under 50 %
    const lean = checkCheddarStandard({ moisturePercent: 39, fatPercent: 30 });
    expect(lean.fatInDryMatterPercent).toBeCloseTo(49.18, 2);
    expect(lean).toMatchObject({ fatWithinLimit: false, meetsStandard: false });
    expect(checkCheddarStandard({ moisturePercent: 36 }).fatWithinLimit).toBeNull();
  });
});

describe('time helpers (ECMAScript Date)', () => {
  it('reads Date, ISO 8601 string and epoch ms alike, and rejects nonsense', () => {
    const ms = Date.UTC(2024, 5, 1, 10);
    expect(toEpochMs(new Date(ms))).toBe(ms);
    expect(toEpochMs('2024-06-01T10:00:00Z')).toBe(ms);
    expect(toEpochMs(ms)).toBe(ms);
    expect(minutesBetween('2024-06-01T10:00:00Z', '2024-06-01T10:45:00Z')).toBe(45);
    expect(() => toEpochMs('yesterday-ish')).toThrow(RangeError);
  });

  it('numbers days from 1970-01-01: 2000-01-01 is day 10957 (30 × 365 + 7 leap days, Gregorian)', () => {
    expect(dayNumber({ year: 1970, month: 1, day: 1 })).toBe(0);
    expect(dayNumber({ year: 2000, month: 1, day: 1 })).toBe(10957);
    expect(dateOfDayNumber(10957)).toEqual({ year: 2000, month: 1, day: 1 });
    // ISO 8601 calendar date, extended format
    expect(isoDate({ year: 2024, month: 3, day: 9 })).toBe('2024-03-09');
  });
});

describe('weigh-ins that look wrong (common practice, no published source)', () => {
  it('doubts a gain over the last weigh-in, and a loss beyond what a wheel loses in the time', () => {
    const last = { date: '2026-03-01', massKg: 1.48 };
    expect(weighInDoubt(last, { date: '2026-03-08', massKg: 2 })).toEqual({
      kind: 'heavier',
      changePercent: 35.1,
      days: 7,
    });
    expect(weighInDoubt(last, { date: '2026-03-08', massKg: 1.49 })).toBeNull(); // scale noise
    expect(weighInDoubt(last, { date: '2026-03-08', massKg: 1.4 })).toBeNull(); // 5.4 % in a week
    expect(weighInDoubt(last, { date: '2026-03-02', massKg: 1.2 })).toMatchObject({
      kind: 'too-light',
      days: 1,
    });
    expect(weighInDoubt(last, { date: '2026-06-01', massKg: 0.9 })).toMatchObject({
      kind: 'too-light',
    }); // more than 30 % at once
    expect(weighInDoubt(null, { date: '2026-03-08', massKg: 2 })).toBeNull();
    expect(weighInDoubt(last, { date: '2026-02-20', massKg: 2 })).toBeNull(); // back-dated
  });
});

describe('wheelAgeDays', () => {
  // Common practice, no published source: a wheel stops aging once it is cut.
  it('counts to today while the wheel ages, and to the day it was cut once it is opened', () => {
    const made = '2026-01-10';
    const today = '2026-04-10';
    expect(wheelAgeDays(made, { wheelStatus: 'aging', openedOn: null }, today)).toBe(90);
    expect(wheelAgeDays(made, { wheelStatus: 'opened', openedOn: '2026-03-11' }, today)).toBe(60);
    expect(wheelAgeDays(made, { wheelStatus: 'finished', openedOn: '2026-03-11' }, today)).toBe(60);
    // Back in the cave, or opened without a recorded day: the running age.
    expect(wheelAgeDays(made, { wheelStatus: 'aging', openedOn: '2026-03-11' }, today)).toBe(90);
    expect(wheelAgeDays(made, { wheelStatus: 'opened', openedOn: null }, today)).toBe(90);
  });
});
