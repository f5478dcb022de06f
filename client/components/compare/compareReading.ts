// The plain-language reading under the Compare chart: what the numbers say, in the reader's
// units, with the filters named, the uncertainty stated as plainly as the slope, and the
// cautions that keep it honest (repeat tastings, mixed styles, raw milk).

import {
  CORRELATION_SIZE,
  type CompareOutcomeKey,
  type CompareParameterKey,
} from '@shared/constants/compare';
import type { HeatTreatment, RindTreatment, Species } from '@shared/constants/journal';
import { correlationSize, formatNumber, type UnitSystem } from '@shared/trade';
import type { CompareResultDto } from '@shared/types/compare';
import { formatOutcome, isBatchOutcome, parameterOf, parameterScale } from './compareUnits';

/** The filters of a comparison, as the reading names them. */
export type ReadingFilters = {
  styleNames: string[];
  species: Species[];
  heat: HeatTreatment[];
  rind: RindTreatment[];
  agingMin: number | null;
  agingMax: number | null;
  maker: string;
};

const SPECIES_WORDS: Record<Species, string> = {
  cow: "cow's",
  goat: "goat's",
  sheep: "sheep's",
  buffalo: "buffalo's",
  mixed: 'mixed',
};

const HEAT_WORDS: Record<HeatTreatment, string> = {
  raw: 'raw',
  thermised: 'thermised',
  pasteurised: 'pasteurised',
  'ultra-pasteurised': 'ultra-pasteurised',
};

const RIND_WORDS: Record<RindTreatment, string> = {
  natural: 'with a natural rind',
  waxed: 'waxed',
  'vacuum-sealed': 'vacuum-sealed',
  'cloth-bound': 'cloth-bound',
  oiled: 'oiled',
  other: 'with another rind treatment',
};

/** "a", "a or b", "a, b or c" (or with "and"). */
export function orList(words: string[], joiner: 'or' | 'and' = 'or'): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} ${joiner} ${words[words.length - 1]}`;
}

/** The text with its first letter in upper case, to start a sentence. */
export const capitalise = (text: string): string => text.charAt(0).toUpperCase() + text.slice(1);

/** A count with its noun: "1 tasting", "23 tastings", "1 batch", "4 batches". */
export function countOf(n: number, per: 'tasting' | 'journal'): string {
  if (per === 'tasting') return `${n} ${n === 1 ? 'tasting' : 'tastings'}`;
  return `${n} ${n === 1 ? 'batch' : 'batches'}`;
}

/** The filters as words after the count: " of Cheddar from raw cow's milk, waxed, by @ann". */
export function filterWords(f: ReadingFilters): string {
  let text = f.styleNames.length ? ` of ${orList(f.styleNames)}` : '';
  if (f.species.length || f.heat.length) {
    const heat = f.heat.length ? `${orList(f.heat.map((h) => HEAT_WORDS[h]))} ` : '';
    const milk = f.species.length
      ? `${orList(f.species.map((s) => SPECIES_WORDS[s]))} milk`
      : 'milk';
    text += ` from ${heat}${milk}`;
  }
  const extras: string[] = [];
  if (f.rind.length) extras.push(orList(f.rind.map((r) => RIND_WORDS[r])));
  if (f.agingMin !== null && f.agingMax !== null)
    extras.push(`with an aging target of ${f.agingMin} to ${f.agingMax} days`);
  else if (f.agingMin !== null) extras.push(`with an aging target of at least ${f.agingMin} days`);
  else if (f.agingMax !== null) extras.push(`with an aging target of at most ${f.agingMax} days`);
  if (f.maker) extras.push(`made by @${f.maker}`);
  return extras.length ? `${text}, ${extras.join(', ')}` : text;
}

// How one step of each numeric parameter reads. `{amount}` is "gram" for a step of one where
// a word exists, otherwise the number with its symbol ("0.1 g", "10 kPa", "1 °F").
type StepWords = { template: string; one?: { metric: string; us: string } };

const STEP_WORDS: Partial<Record<CompareParameterKey, StepWords>> = {
  saltPerLitre: {
    template: 'each extra {amount} of salt per {milk} of milk',
    one: { metric: 'gram', us: 'ounce' },
  },
  saltPercent: {
    template: 'each extra {amount} of salt in the green cheese',
    one: { metric: 'percentage point', us: 'percentage point' },
  },
  colourPerLitre: {
    template: 'each extra {amount} of colouring per {milk} of milk',
    one: { metric: 'millilitre', us: 'teaspoon' },
  },
  calciumChloridePerLitre: {
    template: 'each extra {amount} of calcium chloride per {milk} of milk',
    one: { metric: 'millilitre', us: 'teaspoon' },
  },
  culturePerLitre: {
    template: 'each extra {amount} of culture per {milk} of milk',
    one: { metric: 'gram', us: 'ounce' },
  },
  coagulationTemp: { template: 'each {amount} higher coagulation temperature' },
  cookTemp: { template: 'each {amount} higher cooking temperature' },
  cookRamp: { template: 'each extra {amount} on the fastest heating ramp' },
  pressMaxKpa: { template: 'each extra {amount} of top pressure on the curd' },
  dryingDays: { template: 'each extra {amount} of drying', one: { metric: 'day', us: 'day' } },
  ageDays: { template: 'each extra {amount} of age at tasting', one: { metric: 'day', us: 'day' } },
  yieldPercent: {
    template: 'each extra {amount} of yield',
    one: { metric: 'percentage point', us: 'percentage point' },
  },
};

// The unit written after a number in a step, where it differs from the axis symbol.
const STEP_SYMBOLS: Record<string, string> = {
  'g/L': 'g',
  'oz/gal': 'oz',
  'mL/L': 'mL',
  'tsp/gal': 'tsp',
  '%': 'percentage points',
  '% of milk weight': 'percentage points',
  days: 'days',
};

/**
 * A round step for the slope to be read per: a power of ten near the spread of the values
 * shown (1 g/L when salt runs from 1.8 to 3.6 g/L; 0.1 mL/L for colouring), never more than
 * one degree for temperatures.
 */
export function stepFor(spread: number, kind: string): number {
  if (!(spread > 0)) return 1;
  const step = 10 ** Math.floor(Math.log10(spread));
  return kind === 'temperature' || kind === 'temperature-rate' ? Math.min(1, step) : step;
}

const MINUS = '\u2212';

/** A signed number for the reading, "+0.4" or "−0.12" (two significant digits). */
export function signed(value: number): string {
  const text = formatNumber(Math.abs(value), { significant: 2, maxDecimals: 3 });
  if (text === '0') return '0';
  return `${value < 0 ? MINUS : '+'}${text}`;
}

/** The outcome as a quantity after a signed change: "points of overall liking". */
export function outcomeWords(key: CompareOutcomeKey, amount: string): string {
  const points = amount.replace(/^[+\u2212]/, '') === '1' ? 'point' : 'points';
  switch (key) {
    case 'overall':
      return `${points} of overall liking`;
    case 'yieldPercent':
      return `percentage ${points} of yield`;
    case 'moistureLossPercent':
      return `percentage ${points} of weight lost since the press`;
    case 'texture':
      return `${points} for body and texture`;
    default:
      return `${points} for ${key}`;
  }
}

/** What the outcome is called in a sentence: "overall liking", "the flavour score". */
export function outcomeName(key: CompareOutcomeKey): string {
  if (key === 'overall') return 'overall liking';
  if (key === 'yieldPercent') return 'yield';
  if (key === 'moistureLossPercent') return 'weight lost since the press';
  if (key === 'texture') return 'the body and texture score';
  return `the ${key} score`;
}

/**
 * How large a correlation r is, in the words of a named convention (Cohen 1988, §3.2:
 * 0.1 small, 0.3 medium, 0.5 large; CORRELATION_SIZE), with its article.
 */
export function strengthOf(r: number): string {
  const size = correlationSize(r);
  return size === 'below small' ? 'a below-small' : size === 'medium' ? 'a medium' : `a ${size}`;
}

/** A caution beside the reading: what could mislead, and what to do about it. */
export type ReadingNote = {
  key: 'per-tasting' | 'styles' | 'raw-milk';
  title: string;
  text: string;
  /** Raw milk links to the safety notes. */
  tone: 'warning' | 'safety';
};

export type Reading = {
  /** The main sentences. */
  text: string[];
  /** Cautions that apply to this comparison (pseudo-replication, mixed styles, raw milk). */
  notes: ReadingNote[];
  /** That a relation across members' batches is not a cause, with n; empty with no points. */
  caveat: string;
  /** True when the server said the fit is not meaningful (its caution is shown instead). */
  notMeaningful: boolean;
};

/** How many batches the points come from, when every point is on hand (null otherwise). */
export function batchCount(result: CompareResultDto): number | null {
  if (result.kind !== 'numeric' || result.points.length !== result.n) return null;
  return new Set(result.points.map((p) => p.journalId)).size;
}

/**
 * Who the numbers are about: "Across 7 batches of Cheddar (each the mean of its tastings)",
 * or "Across 28 tastings of 7 batches" when every scorecard is a point.
 */
function subject(result: CompareResultDto, filters: ReadingFilters): string {
  const mean =
    result.per === 'journal' && !isBatchOutcome(result.y) ? ' (each the mean of its tastings)' : '';
  const batches = result.per === 'tasting' ? batchCount(result) : null;
  const of = batches !== null ? ` of ${countOf(batches, 'journal')}` : '';
  return `Across ${countOf(result.n, result.per)}${of}${filterWords(filters)}${mean}`;
}

/** The plain-words meaning of the 95 % interval, said once under the slope. */
export const INTERVAL_MEANING =
  'The 95 % interval is the range of slopes these points allow: worked out this way, such a ' +
  'range holds the true slope 95 times in 100. Few or scattered points make it wide.';

/** What r is and how large this one is by Cohen's convention, with n. */
function correlationWords(
  r: number,
  r2: number,
  n: number,
  per: 'tasting' | 'journal',
  what: string,
  crossesZero: boolean,
): string {
  const { small, medium, large } = CORRELATION_SIZE;
  const value = formatNumber(r, { significant: 2, maxDecimals: 2 });
  const size = correlationSize(r);
  let text =
    `r = ${value} over ${countOf(n, per)}: ${strengthOf(r)} correlation by Cohen's rule of ` +
    `thumb (${small} small, ${medium} medium, ${large} large; Cohen 1988). r runs from ` +
    `${MINUS}1 to +1 and says how closely the points follow a straight line; 0 means no ` +
    `straight-line pattern. The line matches about ${Math.round(r2 * 100)} % of the spread in ${what}.`;
  if (crossesZero && (size === 'large' || size === 'medium'))
    text +=
      ` With only ${countOf(n, per)}, even an r this size can come about by chance, which is ` +
      'why the interval still crosses zero.';
  return text;
}

function numericReading(
  result: CompareResultDto,
  filters: ReadingFilters,
  system: UnitSystem,
  xName: string,
): Reading {
  const head = subject(result, filters);
  const fit = result.fit;
  if (!result.meaningful || !fit)
    return { text: [`${head}.`], notes: [], caveat: '', notMeaningful: true };

  const key = result.x as CompareParameterKey;
  const scale = parameterScale(key, system);
  const shown = result.points.map((p) => scale.convert(p.x));
  const spread = Math.max(...shown) - Math.min(...shown);
  const step = stepFor(spread, parameterOf(key).kind);
  const perStep = (v: number) => (v / scale.factor) * step;

  const words = STEP_WORDS[key];
  const one = words?.one?.[system];
  const stepText = formatNumber(step, { significant: 1, maxDecimals: 4 });
  const symbol = STEP_SYMBOLS[scale.symbol] ?? scale.symbol;
  const amount = step === 1 && one ? one : `${stepText} ${symbol}`;
  const change = (words?.template ?? `each extra {amount} of ${xName.toLowerCase()}`)
    .replace('{amount}', amount)
    .replace('{milk}', system === 'us' ? 'gallon' : 'litre');

  const slope = signed(perStep(fit.slope));
  const [lo, hi] = fit.slopeInterval95.map(perStep);
  const text = [
    `${head}, ${change} went with ${slope} ${outcomeWords(result.y, slope)} ` +
      `(95 % interval ${signed(lo)} to ${signed(hi)}).`,
    INTERVAL_MEANING,
  ];
  const what = outcomeName(result.y);
  const crossesZero = lo <= 0 && hi >= 0;
  if (crossesZero)
    text.push(
      `That interval runs from below zero to above it, so these data do not show a clear ` +
        `direction: ${xName.toLowerCase()} may go with higher or lower ${what}, or make no difference.`,
    );
  else if (result.per === 'tasting')
    text.push(
      `The whole interval is ${lo > 0 ? 'above' : 'below'} zero, but with every tasting counted ` +
        'as a point it is too narrow (see “Each tasting counts as a point”): counted once per ' +
        'batch, the direction may not be clear.',
    );
  else
    text.push(
      `The whole interval is ${lo > 0 ? 'above' : 'below'} zero: in these batches, higher ` +
        `values went with ${lo > 0 ? 'higher' : 'lower'} ${what}.`,
    );
  if (fit.r !== null) {
    const r2 = fit.rSquared ?? fit.r * fit.r;
    text.push(correlationWords(fit.r, r2, result.n, result.per, what, crossesZero));
  }
  return { text, notes: [], caveat: '', notMeaningful: false };
}

function categoricalReading(result: CompareResultDto, filters: ReadingFilters): Reading {
  const head = subject(result, filters);
  // Style names are proper names; "waxed" or "cow's milk" read in lower case mid-sentence.
  const name = (label: string) => (result.x === 'style' ? label : label.toLowerCase());
  const groups = [...result.groups]
    .sort((a, b) => b.mean - a.mean)
    .map((g) => ({ ...g, label: name(g.label) }));
  const what = outcomeName(result.y);
  const value = (v: number) => formatOutcome(result.y, v);
  const text: string[] = [];
  if (groups.length === 1) {
    const g = groups[0];
    text.push(`${head}, all are ${g.label}: average ${what} ${value(g.mean)}.`);
  } else if (groups.length > 1) {
    const top = groups[0];
    const bottom = groups[groups.length - 1];
    text.push(
      `${head}, the highest average ${what} was for ${top.label} ` +
        `(${value(top.mean)} over ${countOf(top.n, result.per)}) and the lowest for ` +
        `${bottom.label} (${value(bottom.mean)} over ${countOf(bottom.n, result.per)}).`,
    );
    const few = `fewer than 5 ${result.per === 'tasting' ? 'tastings' : 'batches'}`;
    const thin = groups.filter((g) => g.n < 5).map((g) => g.label);
    if (thin.length === groups.length)
      text.push(`Every group has ${few}, so these averages say little on their own.`);
    else if (thin.length)
      text.push(
        `${capitalise(orList(thin, 'and'))} ${thin.length === 1 ? 'has' : 'have'} ${few}, ` +
          `so ${thin.length === 1 ? 'its average says little on its' : 'their averages say little on their'} own.`,
      );
    text.push(
      'The boxes show where the middle half of the scores lie; where boxes overlap, the groups ' +
        'are not clearly different.',
    );
  }
  return { text, notes: [], caveat: '', notMeaningful: !result.meaningful };
}

/** The reading of a comparison in plain words, in the reader's units. */
export function readingOf(
  result: CompareResultDto,
  filters: ReadingFilters,
  system: UnitSystem,
  xName: string,
): Reading {
  if (result.n === 0) return { text: [], notes: [], caveat: '', notMeaningful: true };
  const reading =
    result.kind === 'categorical'
      ? categoricalReading(result, filters)
      : numericReading(result, filters, system, xName);
  return { ...reading, notes: notesFor(result, filters, xName), caveat: caveatOf(result) };
}

/** That a relation across members' batches is not a cause, with the count of points. */
export function caveatOf(result: CompareResultDto): string {
  return (
    `A relation across these ${countOf(result.n, result.per)} from members' journals is not a ` +
    'cause: the milk, the culture, the cave and the tasters differ from one batch to the next, ' +
    'and with few points one odd wheel can tilt the line. These are home batches, not a ' +
    'controlled trial: use a reading as an idea to try in your own next batch, not as proof.'
  );
}

/** The pseudo-replication caution for a comparison with one point per tasting. */
export function perTastingNote(result: CompareResultDto): ReadingNote {
  const batches = batchCount(result);
  const from =
    batches !== null && batches < result.n
      ? `These ${countOf(result.n, 'tasting')} come from only ${countOf(batches, 'journal')}. `
      : '';
  return {
    key: 'per-tasting',
    tone: 'warning',
    title: 'Each tasting counts as a point',
    text:
      `${from}Several tastings of the same wheel are not independent: they share its milk, its ` +
      'make and its cave, so they agree with each other more than separate batches would. ' +
      'Counting each as its own point makes the 95 % interval too narrow and the answer look ' +
      'surer than it is (statisticians call this pseudo-replication). Choose “One batch” for ' +
      'a fair interval.',
  };
}

/**
 * The styles caution: a numeric parameter whose usual values differ by style, compared over
 * no style or several, may show the difference between styles rather than its own effect.
 */
export function stylesNote(
  key: CompareParameterKey,
  filters: ReadingFilters,
  xName: string,
): ReadingNote | null {
  const example = (parameterOf(key) as { byStyle?: string }).byStyle;
  if (!example || filters.styleNames.length === 1) return null;
  const chosen = filters.styleNames.length
    ? `${orList(filters.styleNames, 'and')} mixed together`
    : 'every style mixed together';
  return {
    key: 'styles',
    tone: 'warning',
    title: 'Styles differ',
    text:
      `${xName} differs a lot from one style to another: ${example}. With ${chosen}, the line ` +
      `can show the difference between styles rather than what ${xName.toLowerCase()} does ` +
      'within one. Pick one style in the filters to compare like with like.',
  };
}

/** The raw-milk caution (CDC and FDA guidance; 21 CFR 133.113), as on the journal page. */
export const RAW_MILK_NOTE: ReadingNote = {
  key: 'raw-milk',
  tone: 'safety',
  title: 'Raw-milk cheese: scores say nothing about safety',
  text:
    'Raw (unpasteurised) milk can carry Listeria, E. coli O157:H7, Salmonella, Campylobacter ' +
    'and Brucella (CDC and FDA guidance); aging at least 60 days (21 CFR 133.113) lowers that ' +
    'risk without removing it. Pregnant people, young children, older adults and anyone with a ' +
    'weakened immune system should avoid raw-milk cheese. Tasting scores say nothing about ' +
    'whether a cheese is safe to eat, so a higher score for raw milk here is no reason to use ' +
    'it. Follow your local food codes, which may be stricter.',
};

/** Every caution that applies to this comparison, in the order they are shown. */
export function notesFor(
  result: CompareResultDto,
  filters: ReadingFilters,
  xName: string,
): ReadingNote[] {
  const notes: ReadingNote[] = [];
  if (result.x === 'heatTreatment' || filters.heat.some((h) => h === 'raw' || h === 'thermised'))
    notes.push(RAW_MILK_NOTE);
  if (result.per === 'tasting' && result.n > 0) notes.push(perTastingNote(result));
  if (result.kind === 'numeric') {
    const styles = stylesNote(result.x as CompareParameterKey, filters, xName);
    if (styles) notes.push(styles);
  }
  return notes;
}
