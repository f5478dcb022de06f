// Small display helpers for journals, shared by Discover, the journal page and My journals.

import type { JournalStatus, Visibility } from '@shared/constants/journal';
import { dayInWords } from '@shared/trade/time';

const DAYS_PER_MONTH = 30.44;

/** An age or a span of days as a maker says it: "12 days", "1 day", "4 months". */
export function formatDays(days: number | null | undefined): string {
  if (days === null || days === undefined || !Number.isFinite(days)) return '–';
  const whole = Math.round(days);
  if (Math.abs(whole) < 60) return `${whole} ${Math.abs(whole) === 1 ? 'day' : 'days'}`;
  const months = Math.round((whole / DAYS_PER_MONTH) * 2) / 2;
  return `${months} months`;
}

/** A calendar date "YYYY-MM-DD" in words, e.g. "14 Mar 2026", read as a date (no time zone). */
export const formatDate = dayInWords;

/**
 * A time of day for "Saved at 10:42", in the browser's zone and clock (13:05 or 1:05 PM, as
 * the device is set; the same as At the vat's times).
 */
export function formatClock(at: Date | string): string {
  return new Date(at).toLocaleTimeString(undefined, { hour: 'numeric', minute: '2-digit' });
}

/** A mean score on the 1–9 scale with one decimal, or a dash when nobody has scored it. */
export function formatScore(mean: number | null | undefined): string {
  return mean === null || mean === undefined ? '–' : mean.toFixed(1);
}

export const STATUS_LABELS: Record<JournalStatus, string> = {
  draft: 'Draft',
  published: 'Published',
};

export const VISIBILITY_LABELS: Record<Visibility, string> = {
  public: 'Public',
  unlisted: 'Unlisted (link only)',
  private: 'Private',
};

export const VISIBILITY_HINTS: Record<Visibility, string> = {
  public: 'Listed in Discover and on your profile.',
  unlisted: 'Not listed anywhere; anyone with the link can read it.',
  private: 'Only you can see it.',
};

// Rates per volume of milk read per litre in metric and per US gallon in US customary.
const L_PER_GAL = 3.785411784;
const G_PER_OZ = 28.349523125;
const ML_PER_TSP = 4.92892159375;

/** A mass per litre of milk (g/L) in the reader's units: "2.5 g per L" or "0.33 oz per gal". */
export function formatMassPerMilk(gramsPerLitre: number, system: 'metric' | 'us'): string {
  if (system === 'us') return `${trim((gramsPerLitre * L_PER_GAL) / G_PER_OZ)} oz per gal`;
  return `${trim(gramsPerLitre)} g per L`;
}

/** A volume per litre of milk (mL/L) in the reader's units: "0.2 mL per L" or "0.15 tsp per gal". */
export function formatVolumePerMilk(mlPerLitre: number, system: 'metric' | 'us'): string {
  if (system === 'us') return `${trim((mlPerLitre * L_PER_GAL) / ML_PER_TSP)} tsp per gal`;
  return `${trim(mlPerLitre)} mL per L`;
}

function trim(value: number): string {
  if (!Number.isFinite(value)) return '–';
  const digits = Math.abs(value) >= 10 ? 1 : Math.abs(value) >= 1 ? 2 : 3;
  return String(Number(value.toFixed(digits)));
}

/** A percentage with one decimal, "12.3 %" (NIST SP 811 puts a space before %). */
export function formatPercent(value: number | null | undefined, decimals = 1): string {
  return value === null || value === undefined || !Number.isFinite(value)
    ? '–'
    : `${value.toFixed(decimals)} %`;
}

/** Minutes as "45 min" or "2 h 30 min". */
export function formatMinutes(minutes: number | null | undefined): string {
  if (minutes === null || minutes === undefined || !Number.isFinite(minutes)) return '–';
  const m = Math.round(minutes);
  if (m < 60) return `${m} min`;
  const h = Math.floor(m / 60);
  const rest = m % 60;
  return rest ? `${h} h ${rest} min` : `${h} h`;
}

/** The warning for an aging range that cannot match anything (to before from), or undefined. */
export function agingRangeProblem(
  from: number | null | undefined,
  to: number | null | undefined,
): string | undefined {
  if (from === null || from === undefined || to === null || to === undefined || to >= from)
    return undefined;
  return `${to} days is before ${from}: no batch can match. Swap them or clear one.`;
}
