// Aging: how old a wheel is, how long until its target, and the raw-milk caution.
// Ages count calendar days (a wheel made on the 1st is 1 day old on the 2nd whatever the
// hour), in the member's time zone when given, else UTC, so daylight-saving changes never
// make a day of 23 or 25 hours count wrong.

import { calendarDateOf, dateOfDayNumber, dayInWords, dayNumber, isoDate } from './time';
import type { CalendarDate, TimeInput } from './time';

/** Minimum aging of cheddar made from unpasteurised milk, days (21 CFR 133.113). */
export const RAW_MILK_MIN_AGING_DAYS = 60;

/** Minimum aging temperature for unpasteurised-milk cheddar: 35 °F in °C (21 CFR 133.113). */
export const RAW_MILK_MIN_AGING_TEMP_C = (35 - 32) / 1.8;

function dayOf(at: TimeInput | CalendarDate, timeZone?: string): number {
  if (typeof at === 'object' && !(at instanceof Date)) return dayNumber(at);
  return dayNumber(calendarDateOf(at, timeZone));
}

/** Returns the wheel's age in whole calendar days on a date (days; Gregorian calendar). */
export function ageInDays(
  madeOn: TimeInput | CalendarDate,
  at: TimeInput | CalendarDate,
  timeZone?: string,
): number {
  return dayOf(at, timeZone) - dayOf(madeOn, timeZone);
}

/** Returns the ready date, ISO "YYYY-MM-DD" (make date + target days; Gregorian calendar). */
export function readyDate(
  madeOn: TimeInput | CalendarDate,
  targetDays: number,
  timeZone?: string,
): string {
  if (!Number.isInteger(targetDays) || targetDays < 0) {
    throw new RangeError('Target days must be a whole number of days, zero or more');
  }
  return isoDate(dateOfDayNumber(dayOf(madeOn, timeZone) + targetDays));
}

/** Returns the days left to the aging target (days, negative once past; Gregorian calendar). */
export function daysToTarget(
  madeOn: TimeInput | CalendarDate,
  targetDays: number,
  at: TimeInput | CalendarDate,
  timeZone?: string,
): number {
  if (!Number.isInteger(targetDays) || targetDays < 0) {
    throw new RangeError('Target days must be a whole number of days, zero or more');
  }
  return targetDays - ageInDays(madeOn, at, timeZone);
}

export interface RawMilkCaution {
  /** true when the wheel is raw-milk cheese younger than the 60-day minimum */
  flagged: boolean;
  ageDays: number;
  /** days still short of 60 (0 when not short) */
  daysShort: number;
  /** first date the 60-day minimum is met, ISO "YYYY-MM-DD" */
  minimumMetOn: string;
  /** caution text to show; empty when not flagged */
  message: string;
  source: string;
}

const RAW_MILK_SOURCE =
  '21 CFR 133.113 (cheddar from unpasteurised milk: held at least 60 days at no less than ' +
  '35 °F / 1.7 °C before sale; the standards of other varieties in 21 CFR part 133 say the ' +
  'same); CDC and FDA public guidance on raw milk';

/** The US sale rule for raw-milk cheese, said plainly (21 CFR 133.113 and part 133). */
export const RAW_MILK_SALE_RULE =
  'In the United States, cheese made from unpasteurised milk must be held at least ' +
  `${RAW_MILK_MIN_AGING_DAYS} days at no less than 1.7 °C (35 °F) before it is sold ` +
  '(21 CFR 133.113 for cheddar, and the standards of other varieties in 21 CFR part 133). ' +
  'That is a rule for sale, not a promise that the cheese is safe to eat.';

/** Who should not eat raw-milk cheese, and why (CDC and FDA public guidance on raw milk). */
export const RAW_MILK_WHO_SHOULD_AVOID =
  'Raw milk can carry Listeria, E. coli O157:H7, Salmonella, Campylobacter and Brucella, and ' +
  'aging lowers that risk without removing it: pregnant people, young children, older adults ' +
  'and anyone with a weakened immune system should not eat raw-milk cheese (CDC and FDA ' +
  'public guidance).';

/** The closing deferral to local rules, shown with every raw-milk caution. */
export const RAW_MILK_LOCAL_RULES = 'Local rules and food codes may be stricter and come first.';

/** true for milk that was not pasteurised: raw, or only thermised (heated below pasteurising). */
export const isUnpasteurised = (heatTreatment: string) =>
  heatTreatment === 'raw' || heatTreatment === 'thermised';

export interface RawMilkReadyCheck {
  /** first date the 60-day minimum is met, ISO "YYYY-MM-DD" */
  minimumMetOn: string;
  /** true when the wheel's ready date (make date + target) comes before that date */
  readyBeforeMinimum: boolean;
  /** days between the ready date and the 60-day mark (0 when not before it) */
  daysShortAtReady: number;
}

/**
 * Returns, for a wheel of unpasteurised-milk cheese with an aging target, the 60-day mark
 * and whether the ready date comes before it (days; 21 CFR 133.113); null for pasteurised
 * milk or without a target.
 */
export function rawMilkReadyCheck(input: {
  heatTreatment: string;
  madeOn: TimeInput | CalendarDate;
  targetDays: number | null;
  timeZone?: string;
}): RawMilkReadyCheck | null {
  if (!isUnpasteurised(input.heatTreatment) || input.targetDays === null) return null;
  const daysShortAtReady = Math.max(0, RAW_MILK_MIN_AGING_DAYS - input.targetDays);
  return {
    minimumMetOn: readyDate(input.madeOn, RAW_MILK_MIN_AGING_DAYS, input.timeZone),
    readyBeforeMinimum: daysShortAtReady > 0,
    daysShortAtReady,
  };
}

/** Wheel statuses after the wheel was cut: its age stops at the day it was opened. */
export const CUT_WHEEL_STATUSES: readonly string[] = ['opened', 'finished'];

/**
 * Returns the day a wheel's age stops (ISO "YYYY-MM-DD"): the day it was cut, for an opened
 * or finished wheel whose opening day is known; null while it still ages (common practice,
 * no published source: a wheel stops aging once cut).
 */
export function cutOn(wheel: { wheelStatus: string; openedOn: string | null }): string | null {
  return CUT_WHEEL_STATUSES.includes(wheel.wheelStatus) ? wheel.openedOn : null;
}

/**
 * Returns a wheel's age in whole days: today's for a wheel still aging, and its age on the
 * day it was cut (cutOn) for an opened or finished one.
 */
export function wheelAgeDays(
  madeOn: TimeInput | CalendarDate,
  wheel: { wheelStatus: string; openedOn: string | null },
  at: TimeInput | CalendarDate,
  timeZone?: string,
): number {
  return ageInDays(madeOn, cutOn(wheel) ?? at, timeZone);
}

/**
 * Returns the opened-on date a journal should keep when its wheel moves from one status to
 * another (ISO "YYYY-MM-DD" or null): the day it is first cut (`today`), kept through
 * opened and finished, cleared when the wheel goes back to the cave (common practice, no
 * published source: a wheel stops aging once cut).
 */
export function openedOnAfter(
  previous: { wheelStatus: string; openedOn: string | null },
  nextStatus: string,
  today: string,
): string | null {
  if (!CUT_WHEEL_STATUSES.includes(nextStatus))
    return nextStatus === 'discarded' ? previous.openedOn : null;
  return previous.openedOn ?? today;
}

// Shown when a wheel of unpasteurised-milk cheese is opened or shared before 60 days.
/** Returns the raw-milk flag, days short of 60 and caution text (21 CFR 133.113; CDC/FDA). */
export function rawMilkCaution(input: {
  /** true for any milk that was not pasteurised (raw or only thermised) */
  unpasteurised: boolean;
  madeOn: TimeInput | CalendarDate;
  at: TimeInput | CalendarDate;
  timeZone?: string;
}): RawMilkCaution {
  const ageDays = ageInDays(input.madeOn, input.at, input.timeZone);
  const minimumMetOn = readyDate(input.madeOn, RAW_MILK_MIN_AGING_DAYS, input.timeZone);
  const daysShort = input.unpasteurised ? Math.max(0, RAW_MILK_MIN_AGING_DAYS - ageDays) : 0;
  const flagged = daysShort > 0;
  const message = flagged
    ? `This wheel is cheese from unpasteurised milk and is ${ageDays} ${ageDays === 1 ? 'day' : 'days'} old; ` +
      `it reaches ${RAW_MILK_MIN_AGING_DAYS} days on ${dayInWords(minimumMetOn)}, ${daysShort} ` +
      `${daysShort === 1 ? 'day' : 'days'} later. ${RAW_MILK_SALE_RULE} ` +
      `${RAW_MILK_WHO_SHOULD_AVOID} ${RAW_MILK_LOCAL_RULES}`
    : '';
  return { flagged, ageDays, daysShort, minimumMetOn, message, source: RAW_MILK_SOURCE };
}
