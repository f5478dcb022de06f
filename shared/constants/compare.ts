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
};

export const COMPARE_PARAMETERS = [
  {
    key: 'saltPerLitre',
    label: 'Salt per litre of milk',
    unit: 'g/L',
    kind: 'plain',
    source: 'journal',
  },
  {
    key: 'saltPercent',
    label: 'Salt as % of the green cheese',
    unit: '%',
    kind: 'plain',
    source: 'journal',
  },
  {
    key: 'colourPerLitre',
    label: 'Colouring per litre of milk',
    unit: 'mL/L',
    kind: 'plain',
    source: 'journal',
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
  },
  {
    key: 'coagulationTemp',
    label: 'Coagulation temperature',
    unit: '°C',
    kind: 'temperature',
    source: 'journal',
  },
  {
    key: 'cookTemp',
    label: 'Cooking temperature',
    unit: '°C',
    kind: 'temperature',
    source: 'journal',
  },
  {
    key: 'cookRamp',
    label: 'Fastest heating ramp',
    unit: '°C per 5 min',
    kind: 'temperature-rate',
    source: 'journal',
  },
  {
    key: 'pressMaxKpa',
    label: 'Highest pressure on the curd',
    unit: 'kPa',
    kind: 'pressure',
    source: 'journal',
  },
  { key: 'dryingDays', label: 'Drying days', unit: 'days', kind: 'plain', source: 'journal' },
  { key: 'ageDays', label: 'Age at tasting', unit: 'days', kind: 'plain', source: 'tasting-age' },
  {
    key: 'yieldPercent',
    label: 'Yield',
    unit: '% of milk weight',
    kind: 'plain',
    source: 'journal',
  },
  { key: 'style', label: 'Style', unit: null, kind: 'category', source: 'category' },
  { key: 'species', label: 'Milk', unit: null, kind: 'category', source: 'category' },
  {
    key: 'heatTreatment',
    label: 'Heat treatment',
    unit: null,
    kind: 'category',
    source: 'category',
  },
  {
    key: 'rindTreatment',
    label: 'Rind treatment',
    unit: null,
    kind: 'category',
    source: 'category',
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

/** Fewer points than this and the answer says the fit is not meaningful. */
export const MIN_MEANINGFUL_POINTS = 5;
