// The plain-language reading under the Compare chart: what the numbers say, in the reader's
// units, with the filters named and the uncertainty stated as plainly as the slope.

import type { CompareOutcomeKey, CompareParameterKey } from '@shared/constants/compare';
import type { HeatTreatment, RindTreatment, Species } from '@shared/constants/journal';
import { formatNumber, type UnitSystem } from '@shared/trade';
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

/** How strong a correlation r is, in words (Cohen's conventional 0.1 / 0.3 / 0.5). */
export function strengthOf(r: number): string {
  const a = Math.abs(r);
  if (a < 0.1) return 'hardly any';
  if (a < 0.3) return 'a weak';
  if (a < 0.5) return 'a moderate';
  return 'a strong';
}

export type Reading = {
  /** The main sentences. */
  text: string[];
  /** True when the server said the fit is not meaningful (its caution is shown instead). */
  notMeaningful: boolean;
};

/** Who the numbers are about: "Across 23 tastings of Cheddar" (with "each batch's mean"). */
function subject(result: CompareResultDto, filters: ReadingFilters): string {
  const mean =
    result.per === 'journal' && !isBatchOutcome(result.y) ? ' (each the mean of its tastings)' : '';
  return `Across ${countOf(result.n, result.per)}${filterWords(filters)}${mean}`;
}

function numericReading(
  result: CompareResultDto,
  filters: ReadingFilters,
  system: UnitSystem,
  xName: string,
): Reading {
  const head = subject(result, filters);
  const fit = result.fit;
  if (!result.meaningful || !fit) return { text: [`${head}.`], notMeaningful: true };

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
  ];
  const what = outcomeName(result.y);
  if (lo <= 0 && hi >= 0)
    text.push(
      `That interval runs from below zero to above it, so these data do not show a clear ` +
        `direction: ${xName.toLowerCase()} may go with higher or lower ${what}, or make no difference.`,
    );
  else
    text.push(
      `The whole interval is ${lo > 0 ? 'above' : 'below'} zero: in these batches, higher ` +
        `values went with ${lo > 0 ? 'higher' : 'lower'} ${what}.`,
    );
  if (fit.r !== null) {
    const r2 = fit.rSquared ?? fit.r * fit.r;
    text.push(
      `r = ${formatNumber(fit.r, { significant: 2, maxDecimals: 2 })}: ${strengthOf(fit.r)} ` +
        `relation; the line accounts for about ${Math.round(r2 * 100)} % of the spread in ${what}.`,
    );
  }
  return { text, notMeaningful: false };
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
    text.push(`${head}, all are ${g.label}: mean ${what} ${value(g.mean)}.`);
  } else if (groups.length > 1) {
    const top = groups[0];
    const bottom = groups[groups.length - 1];
    text.push(
      `${head}, the highest mean ${what} was for ${top.label} (${value(top.mean)}, n = ${top.n}) ` +
        `and the lowest for ${bottom.label} (${value(bottom.mean)}, n = ${bottom.n}).`,
    );
    const thin = groups.filter((g) => g.n < 5).map((g) => g.label);
    if (thin.length === groups.length)
      text.push('Every group has fewer than 5 points, so these means say little on their own.');
    else if (thin.length)
      text.push(
        `${capitalise(orList(thin, 'and'))} ${thin.length === 1 ? 'has' : 'have'} fewer than 5 ` +
          `points, so ${thin.length === 1 ? 'its mean says little on its' : 'their means say little on their'} own.`,
      );
    text.push(
      'The boxes show where the middle half of the scores lie; where boxes overlap, the groups ' +
        'are not clearly different.',
    );
  }
  return { text, notMeaningful: !result.meaningful };
}

/** The reading of a comparison in plain words, in the reader's units. */
export function readingOf(
  result: CompareResultDto,
  filters: ReadingFilters,
  system: UnitSystem,
  xName: string,
): Reading {
  if (result.n === 0) return { text: [], notMeaningful: true };
  return result.kind === 'categorical'
    ? categoricalReading(result, filters)
    : numericReading(result, filters, system, xName);
}
