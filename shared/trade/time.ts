// Instants and calendar days. Everything that takes a time accepts a Date, an ISO 8601
// string or epoch milliseconds, because journals arrive from JSON, forms and the database.

/** An instant as a Date, an ISO 8601 string or milliseconds since the Unix epoch. */
export type TimeInput = Date | string | number;

export const MS_PER_MINUTE = 60_000;
export const MS_PER_DAY = 86_400_000;

/** Returns the instant as milliseconds since the Unix epoch (ms); ECMAScript Date parsing. */
export function toEpochMs(at: TimeInput): number {
  const ms = at instanceof Date ? at.getTime() : typeof at === 'number' ? at : Date.parse(at);
  if (!Number.isFinite(ms)) {
    throw new RangeError(`Not a valid time: ${String(at)}`);
  }
  return ms;
}

/** Returns the minutes from `from` to `to` (min, negative if `to` is earlier; arithmetic). */
export function minutesBetween(from: TimeInput, to: TimeInput): number {
  return (toEpochMs(to) - toEpochMs(from)) / MS_PER_MINUTE;
}

/** A calendar date, no time of day. */
export interface CalendarDate {
  year: number;
  month: number; // 1-12
  day: number;
}

// One formatter per zone: building Intl.DateTimeFormat is the slow part.
const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string): Intl.DateTimeFormat {
  let formatter = formatters.get(timeZone);
  if (!formatter) {
    formatter = new Intl.DateTimeFormat('en-US', {
      timeZone,
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
    });
    formatters.set(timeZone, formatter);
  }
  return formatter;
}

const DATE_ONLY = /^(\d{4})-(\d{2})-(\d{2})$/;

// A date-only string ("2024-03-01") already is a calendar date and is taken as written in any
// zone, where Date.parse would read it as UTC midnight and shift it a day west of Greenwich.
/** Returns the calendar date of an instant in an IANA time zone, default UTC (ECMA-402 Intl). */
export function calendarDateOf(at: TimeInput, timeZone = 'UTC'): CalendarDate {
  if (typeof at === 'string') {
    const m = DATE_ONLY.exec(at);
    if (m) {
      const date = { year: Number(m[1]), month: Number(m[2]), day: Number(m[3]) };
      if (isoDate(dateOfDayNumber(dayNumber(date))) !== at) {
        throw new RangeError(`Not a valid date: ${at}`);
      }
      return date;
    }
  }
  const ms = toEpochMs(at);
  if (timeZone === 'UTC') {
    const d = new Date(ms);
    return { year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate() };
  }
  const parts = formatterFor(timeZone).formatToParts(new Date(ms));
  const pick = (type: Intl.DateTimeFormatPartTypes): number =>
    Number(parts.find((p) => p.type === type)?.value);
  return { year: pick('year'), month: pick('month'), day: pick('day') };
}

/** Returns the day number of a calendar date (days since 1970-01-01, proleptic Gregorian). */
export function dayNumber(date: CalendarDate): number {
  return Math.round(Date.UTC(date.year, date.month - 1, date.day) / MS_PER_DAY);
}

/** Returns the calendar date of a day number (days since 1970-01-01); inverse of dayNumber. */
export function dateOfDayNumber(days: number): CalendarDate {
  const d = new Date(days * MS_PER_DAY);
  return { year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate() };
}

/**
 * A calendar date "YYYY-MM-DD" in words, e.g. "14 Mar 2026" (read as a date, no time zone),
 * for messages and pages; the ISO string itself if it is not one.
 */
export function dayInWords(iso: string | null | undefined): string {
  if (!iso) return '–';
  const [y, m, d] = iso.slice(0, 10).split('-').map(Number);
  if (!y || !m || !d) return iso;
  return new Date(Date.UTC(y, m - 1, d)).toLocaleDateString('en-GB', {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    timeZone: 'UTC',
  });
}

/** Returns a calendar date as an ISO 8601 date string, e.g. "2024-03-01" (ISO 8601). */
export function isoDate(date: CalendarDate): string {
  const pad = (n: number, width: number): string => String(n).padStart(width, '0');
  return `${pad(date.year, 4)}-${pad(date.month, 2)}-${pad(date.day, 2)}`;
}
