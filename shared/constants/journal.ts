// The trade's vocabulary for a make journal. Keys are stable (stored and used in URLs);
// labels are what the maker reads.

export const SPECIES = ['cow', 'goat', 'sheep', 'buffalo', 'mixed'] as const;
export const HEAT_TREATMENTS = ['raw', 'thermised', 'pasteurised', 'ultra-pasteurised'] as const;
export const RIND_TREATMENTS = [
  'natural',
  'waxed',
  'vacuum-sealed',
  'cloth-bound',
  'oiled',
  'other',
] as const;
export const MOULD_SHAPES = ['round', 'rectangular'] as const;
export const JOURNAL_STATUSES = ['draft', 'published'] as const;
export const VISIBILITIES = ['public', 'unlisted', 'private'] as const;
/** Where the wheel is in its life; 'discarded' ends it without a tasting. */
export const WHEEL_STATUSES = [
  'making',
  'pressing',
  'drying',
  'aging',
  'opened',
  'finished',
  'discarded',
] as const;
export const INGREDIENT_KINDS = [
  'culture',
  'rennet',
  'calcium-chloride',
  'colouring',
  'salt',
  'other',
] as const;
export const STEP_KINDS = [
  'warming',
  'ripening',
  'colouring',
  'coagulation',
  'cutting',
  'healing',
  'cooking',
  'stirring',
  'draining',
  'cheddaring',
  'milling',
  'salting',
  'hooping',
  'pressing',
  'drying',
  'rind-treatment',
  'other',
] as const;
export const JOURNAL_SORTS = ['newest', 'oldest', 'best', 'most-tasted'] as const;

export type Species = (typeof SPECIES)[number];
export type HeatTreatment = (typeof HEAT_TREATMENTS)[number];
export type RindTreatment = (typeof RIND_TREATMENTS)[number];
export type MouldShape = (typeof MOULD_SHAPES)[number];
export type JournalStatus = (typeof JOURNAL_STATUSES)[number];
export type Visibility = (typeof VISIBILITIES)[number];
export type WheelStatus = (typeof WHEEL_STATUSES)[number];
export type IngredientKind = (typeof INGREDIENT_KINDS)[number];
export type StepKind = (typeof STEP_KINDS)[number];
export type JournalSort = (typeof JOURNAL_SORTS)[number];

export const SPECIES_LABELS: Record<Species, string> = {
  cow: "Cow's milk",
  goat: "Goat's milk",
  sheep: "Sheep's milk",
  buffalo: "Buffalo's milk",
  mixed: 'Mixed milks',
};

export const HEAT_TREATMENT_LABELS: Record<HeatTreatment, string> = {
  raw: 'Raw (unpasteurised)',
  thermised: 'Thermised',
  pasteurised: 'Pasteurised',
  'ultra-pasteurised': 'Ultra-pasteurised',
};

export const RIND_LABELS: Record<RindTreatment, string> = {
  natural: 'Natural rind',
  waxed: 'Waxed',
  'vacuum-sealed': 'Vacuum-sealed',
  'cloth-bound': 'Cloth-bound',
  oiled: 'Oiled',
  other: 'Other',
};

export const WHEEL_STATUS_LABELS: Record<WheelStatus, string> = {
  making: 'Being made',
  pressing: 'In the press',
  drying: 'Drying',
  aging: 'Aging',
  opened: 'Opened',
  finished: 'Finished',
  discarded: 'Discarded',
};

export const INGREDIENT_LABELS: Record<IngredientKind, string> = {
  culture: 'Culture',
  rennet: 'Rennet',
  'calcium-chloride': 'Calcium chloride',
  colouring: 'Colouring (annatto etc.)',
  salt: 'Salt',
  other: 'Other',
};

export const STEP_LABELS: Record<StepKind, string> = {
  warming: 'Warming the milk',
  ripening: 'Ripening',
  colouring: 'Colouring',
  coagulation: 'Coagulation (renneting)',
  cutting: 'Cutting the curd',
  healing: 'Healing',
  cooking: 'Cooking',
  stirring: 'Stirring',
  draining: 'Draining the whey',
  cheddaring: 'Cheddaring',
  milling: 'Milling',
  salting: 'Salting',
  hooping: 'Hooping (moulding)',
  pressing: 'Pressing',
  drying: 'Drying',
  'rind-treatment': 'Rind treatment',
  other: 'Other',
};

export const SORT_LABELS: Record<JournalSort, string> = {
  newest: 'Newest makes',
  oldest: 'Oldest makes',
  best: 'Best scored',
  'most-tasted': 'Most tasted',
};
