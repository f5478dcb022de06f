// Drying after the press: the wheel air-dries for the journal's drying days and is turned
// every day so both faces dry evenly (common practice), then gets its rind treatment.
// Day 1 is the day the wheel comes out of the press. Dates are calendar days where the
// maker is (the phone's time zone).

import { calendarDateOf, dateOfDayNumber, dayNumber, isoDate } from '@shared/trade';

export interface DryingDay {
  /** 1-based day of drying */
  day: number;
  /** ISO date, "2026-03-14" */
  date: string;
  turned: boolean;
  isToday: boolean;
  isPast: boolean;
}

export interface DryingPlan {
  days: DryingDay[];
  /** the day to do the rind treatment (the day after the last drying day), ISO date */
  rindDate: string;
  /** today's day of drying, or null before or after drying */
  today: DryingDay | null;
  /** today's turn is still to do */
  turnDue: boolean;
  /** drying is over: today is the rind-treatment day or later */
  over: boolean;
}

/** The phone's time zone (Intl), UTC when the browser does not say. */
export function localTimeZone(): string {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
  } catch {
    return 'UTC';
  }
}

/** Lays out the drying days from the end of pressing with the days already turned. */
export function dryingPlan(
  startMs: number,
  dryingDays: number,
  turnedDates: readonly string[],
  now: number,
  timeZone = localTimeZone(),
): DryingPlan {
  const first = dayNumber(calendarDateOf(startMs, timeZone));
  const todayNumber = dayNumber(calendarDateOf(now, timeZone));
  const count = Math.max(0, Math.ceil(dryingDays));
  const turned = new Set(turnedDates);
  const days: DryingDay[] = Array.from({ length: count }, (_, i) => {
    const n = first + i;
    const date = isoDate(dateOfDayNumber(n));
    return {
      day: i + 1,
      date,
      turned: turned.has(date),
      isToday: n === todayNumber,
      isPast: n < todayNumber,
    };
  });
  const today = days.find((d) => d.isToday) ?? null;
  return {
    days,
    rindDate: isoDate(dateOfDayNumber(first + count)),
    today,
    turnDue: today !== null && !today.turned,
    over: todayNumber >= first + count,
  };
}

/** Ticks a day as turned, or unticks it. */
export function toggleTurned(turnedDates: readonly string[], date: string): string[] {
  return turnedDates.includes(date)
    ? turnedDates.filter((d) => d !== date)
    : [...turnedDates, date].sort();
}
