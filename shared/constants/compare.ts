// What Compare can relate: make parameters (x) and outcomes (y), each with a stable key,
// a plain name and the SI unit its values come in (the client converts for display).

export type QuantityKind = 'temperature' | 'temperature-rate' | 'pressure' | 'plain';

export type CompareParameter = {
  key: string;
  label: string;
  /** SI unit of the values, or null for categories. */
  unit: string | null;
  kind: QuantityKind | 'category';
  /** Where the value comes from: a journal column, the tasting's age, or a category column. */
  source: 'journal' | 'tasting-age' | 'category';
  /**
   * For a numeric parameter whose usual values differ a lot from one style to another: an
   * example in plain words, shown when no style (or several) is chosen. Common practice among
   * home makers, no published source.
   */
  byStyle?: string;
};

export const COMPARE_PARAMETERS = [
  {
    key: 'saltPerLitre',
    label: 'Salt per litre of milk',
    unit: 'g/L',
    kind: 'plain',
    source: 'journal',
    byStyle: 'a feta or a halloumi is salted far more than a camembert or a fresh chèvre',
  },
  {
    key: 'saltPercent',
    label: 'Salt as % of the green cheese',
    unit: '%',
    kind: 'plain',
    source: 'journal',
    byStyle: 'a feta or a halloumi is salted far more than a camembert or a fresh chèvre',
  },
  {
    key: 'colourPerLitre',
    label: 'Colouring per litre of milk',
    unit: 'mL/L',
    kind: 'plain',
    source: 'journal',
    byStyle: 'annatto goes into some cheddars and goudas and into most other styles not at all',
  },
  {
    key: 'calciumChloridePerLitre',
    label: 'Calcium chloride per litre of milk',
    unit: 'mL/L',
    kind: 'plain',
    source: 'journal',
  },
  {
    key: 'culturePerLitre',
    label: 'Culture per litre of milk',
    unit: 'g/L',
    kind: 'plain',
    source: 'journal',
    byStyle:
      'a long-set lactic chèvre takes a pinch of culture, a cheddar or an alpine more, and of another kind',
  },
  {
    key: 'coagulationTemp',
    label: 'Coagulation temperature',
    unit: '°C',
    kind: 'temperature',
    source: 'journal',
    byStyle:
      'a lactic chèvre sets cool and slowly, a cheddar, an alpine or a mozzarella warm and within the hour',
  },
  {
    key: 'cookTemp',
    label: 'Cooking temperature',
    unit: '°C',
    kind: 'temperature',
    source: 'journal',
    byStyle:
      'a camembert or a feta is hardly cooked, a cheddar is cooked warm and an alpine or a grana hot',
  },
  {
    key: 'cookRamp',
    label: 'Fastest heating ramp',
    unit: '°C per 5 min',
    kind: 'temperature-rate',
    source: 'journal',
    byStyle:
      'a camembert or a feta curd is hardly heated, an alpine or a grana curd is heated far and fast',
  },
  {
    key: 'pressMaxKpa',
    label: 'Highest pressure on the curd',
    unit: 'kPa',
    kind: 'pressure',
    source: 'journal',
    byStyle: 'a camembert or a feta drains under its own weight, a cheddar is pressed hard',
  },
  { key: 'dryingDays', label: 'Drying days', unit: 'days', kind: 'plain', source: 'journal' },
  { key: 'ageDays', label: 'Age at tasting', unit: 'days', kind: 'plain', source: 'tasting-age' },
  {
    key: 'yieldPercent',
    label: 'Yield',
    unit: '% of milk weight',
    kind: 'plain',
    source: 'journal',
    byStyle: 'a bloomy rind dries for a day or two, a natural-rind tomme or cheddar for longer',
  },
  { key: 'style', label: 'Style', unit: null, kind: 'category', source: 'category' },
  { key: 'species', label: 'Milk', unit: null, kind: 'category', source: 'category' },
  {
    key: 'heatTreatment',
    label: 'Heat treatment',
    unit: null,
    kind: 'category',
    source: 'category',
    byStyle:
      'a feta or a camembert is eaten within weeks, a cheddar or a grana after months or years',
  },
  {
    key: 'rindTreatment',
    label: 'Rind treatment',
    unit: null,
    kind: 'category',
    source: 'category',
    byStyle:
      'a soft cheese keeps far more whey, so the same milk gives more of it than of a hard one',
  },
] as const satisfies readonly CompareParameter[];

export type CompareOutcome = {
  key: string;
  label: string;
  unit: string;
  level: 'tasting' | 'journal';
};

export const COMPARE_OUTCOMES = [
  { key: 'overall', label: 'Overall liking', unit: '1–9', level: 'tasting' },
  { key: 'appearance', label: 'Appearance', unit: '1–9', level: 'tasting' },
  { key: 'aroma', label: 'Aroma', unit: '1–9', level: 'tasting' },
  { key: 'flavour', label: 'Flavour', unit: '1–9', level: 'tasting' },
  { key: 'texture', label: 'Body and texture', unit: '1–9', level: 'tasting' },
  { key: 'finish', label: 'Finish', unit: '1–9', level: 'tasting' },
  { key: 'yieldPercent', label: 'Yield', unit: '% of milk weight', level: 'journal' },
  { key: 'moistureLossPercent', label: 'Weight lost since the press', unit: '%', level: 'journal' },
] as const satisfies readonly CompareOutcome[];

export type CompareParameterKey = (typeof COMPARE_PARAMETERS)[number]['key'];
export type CompareOutcomeKey = (typeof COMPARE_OUTCOMES)[number]['key'];

export const COMPARE_PARAMETER_KEYS = COMPARE_PARAMETERS.map((p) => p.key) as [
  CompareParameterKey,
  ...CompareParameterKey[],
];
export const COMPARE_OUTCOME_KEYS = COMPARE_OUTCOMES.map((o) => o.key) as [
  CompareOutcomeKey,
  ...CompareOutcomeKey[],
];

// Calcium chloride carries no byStyle example: its dose follows the milk (store-bought,
// pasteurised or homogenised) more than the style (common practice, no published source).

/**
 * The words for the size of a correlation r, by a named convention: Cohen, J. (1988),
 * Statistical Power Analysis for the Behavioral Sciences, 2nd ed., §3.2 [memory for the
 * section]: r ≈ 0.1 small, 0.3 medium, 0.5 large. Cohen offers them as rough guides where
 * nothing better is known, not as proof that a relation is real or causal.
 */
export const CORRELATION_SIZE = {
  source: 'Cohen, J. (1988), Statistical Power Analysis for the Behavioral Sciences, 2nd ed., §3.2',
  small: 0.1,
  medium: 0.3,
  large: 0.5,
} as const;

/** Fewer points than this and the answer says the fit is not meaningful. */
export const MIN_MEANINGFUL_POINTS = 5;
