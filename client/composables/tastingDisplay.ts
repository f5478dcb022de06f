// Display helpers for tastings and the cave: dates, ages in days, score words, vocabularies.

import {
  DEFECTS,
  FLAVOUR_DESCRIPTORS,
  HEDONIC_SCALE,
  SCORE_ATTRIBUTE_LABELS,
  SCORE_ATTRIBUTES,
  typicalTraitsOf,
  type ScoreAttribute,
} from '@shared/constants/tasting';
import { ageInDays, calendarDateOf, dayInWords, isoDate } from '@shared/trade';

const DAYS_PER_MONTH = 30.44;

/** Today's calendar date in the browser's time zone, "YYYY-MM-DD". */
export function todayIso(): string {
  const zone = Intl.DateTimeFormat().resolvedOptions().timeZone;
  return isoDate(calendarDateOf(new Date(), zone));
}

/** A calendar date "YYYY-MM-DD" in words, e.g. "14 Mar 2026" (read as a date, no time zone). */
export const formatDay = dayInWords;

/** "1 day", "45 days". */
export function dayCount(days: number): string {
  return `${days} ${Math.abs(days) === 1 ? 'day' : 'days'}`;
}

/** An age as makers say it, exact days first: "45 days", "122 days (about 4 months)". */
export function formatAge(days: number): string {
  if (days < 60) return dayCount(days);
  const months = Math.round((days / DAYS_PER_MONTH) * 2) / 2;
  return `${dayCount(days)} (about ${months} months)`;
}

/** The age of a wheel made on `makeDate` at `on`, or null when either date is not valid. */
export function ageOn(makeDate: string, on: string): number | null {
  try {
    return ageInDays(makeDate, on);
  } catch {
    return null;
  }
}

/** The scale's words for a score, e.g. 7 → "Like moderately". */
export function scoreWord(score: number | null | undefined): string {
  return HEDONIC_SCALE.find((s) => s.value === score)?.label ?? 'Not scored yet';
}

/** A mean score with one decimal, or a dash. */
export function formatMean(mean: number | null | undefined): string {
  return mean === null || mean === undefined || !Number.isFinite(mean) ? '–' : mean.toFixed(1);
}

export const ATTRIBUTES = SCORE_ATTRIBUTES.map((key) => ({
  key,
  label: SCORE_ATTRIBUTE_LABELS[key],
}));

/** Short column heads for tables on a phone. */
export const ATTRIBUTE_SHORT: Record<ScoreAttribute, string> = {
  overall: 'Overall',
  appearance: 'Look',
  aroma: 'Aroma',
  flavour: 'Flavour',
  texture: 'Body',
  finish: 'Finish',
};

/** What each attribute asks the taster, shown under its picker. */
export const ATTRIBUTE_HINTS: Record<ScoreAttribute, string> = {
  overall: 'How much do you like this cheese, all things considered?',
  appearance: 'Rind, paste colour, eyes or openings, how the cut face looks.',
  aroma: 'What you smell before tasting, close to the cut face.',
  flavour: 'Taste and aromatics in the mouth.',
  texture: 'Firmness, smoothness, how it breaks and melts as you chew.',
  finish: 'What stays after you swallow, and how long.',
};

export type ChipOption = { key: string; label: string; hint?: string };
export type ChipGroup = { title: string; options: ChipOption[] };

const BASIC_TASTES = new Set(['sweet', 'sour', 'salty', 'bitter', 'umami']);

/** The lexicon's terms in its two groups: aromatics and basic tastes (Drake et al. 2001). */
export const DESCRIPTOR_GROUPS: ChipGroup[] = [
  {
    title: 'Aromatics',
    options: FLAVOUR_DESCRIPTORS.filter((d) => !BASIC_TASTES.has(d.key)),
  },
  { title: 'Basic tastes', options: FLAVOUR_DESCRIPTORS.filter((d) => BASIC_TASTES.has(d.key)) },
];

const DEFECT_GROUP_TITLES: Record<string, string> = {
  flavour: 'Flavour',
  body: 'Body and texture',
  colour: 'Colour and finish',
};

/** Defects grouped as the judging references group them. */
export const DEFECT_GROUPS: ChipGroup[] = Object.entries(DEFECT_GROUP_TITLES).map(
  ([group, title]) => ({ title, options: DEFECTS.filter((d) => d.group === group) }),
);

/**
 * The defects for a style, without the ones that are the style's own trait (crumbly for a
 * Caerphilly-type), and those left out, so the scorecard can say so.
 */
export function defectGroupsFor(styleSlug: string | null | undefined): {
  groups: ChipGroup[];
  typical: ChipOption[];
} {
  const typical = typicalTraitsOf(styleSlug);
  return {
    groups: DEFECT_GROUPS.map((g) => ({
      ...g,
      options: g.options.filter((o) => !typical.has(o.key)),
    })).filter((g) => g.options.length),
    typical: DEFECTS.filter((d) => typical.has(d.key)),
  };
}

const DESCRIPTOR_LABELS = new Map<string, string>(FLAVOUR_DESCRIPTORS.map((d) => [d.key, d.label]));
const DEFECT_LABELS = new Map<string, string>(DEFECTS.map((d) => [d.key, d.label]));

/** The label of a descriptor key. */
export const descriptorLabel = (key: string) => DESCRIPTOR_LABELS.get(key) ?? key;
/** The label of a defect key. */
export const defectLabel = (key: string) => DEFECT_LABELS.get(key) ?? key;

/** The sources of the scorecard's scales and word lists, for the small print. */
export const SCORECARD_SOURCES = {
  scale:
    'D. R. Peryam and F. J. Pilgrim, "Hedonic scale method of measuring food preferences", Food Technology 11(9), 1957.',
  descriptors:
    'M. A. Drake, S. C. McIngvale, P. D. Gerard, K. R. Cadwallader and G. V. Civille, "Development of a descriptive language for Cheddar cheese", Journal of Food Science 66(9), 1422–1427, 2001.',
  defects:
    "The ADSA dairy-products scorecard (Michigan State University Extension bulletin F0798) and the USDA grade standards for Cheddar cheese. Both are written for Cheddar; which traits are a style's own rather than a defect is common practice among makers, with no single published source.",
  hints:
    "The short meaning shown for each term is Rindwise's own plain wording, written from memory of the sources above, not quoted from them.",
};
