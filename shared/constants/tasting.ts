// The scorecard's scales and vocabularies, each with the source it comes from.

/**
 * The 9-point hedonic scale: D. R. Peryam and F. J. Pilgrim, "Hedonic scale method of
 * measuring food preferences", Food Technology 11(9), 1957. Rindwise uses it for overall
 * liking and, as a liking score, for each attribute. The category words are the scale's own
 * structure (like/dislike, extremely to slightly, and a neutral middle).
 */
export const HEDONIC_SCALE = [
  { value: 1, label: 'Dislike extremely' },
  { value: 2, label: 'Dislike very much' },
  { value: 3, label: 'Dislike moderately' },
  { value: 4, label: 'Dislike slightly' },
  { value: 5, label: 'Neither like nor dislike' },
  { value: 6, label: 'Like slightly' },
  { value: 7, label: 'Like moderately' },
  { value: 8, label: 'Like very much' },
  { value: 9, label: 'Like extremely' },
] as const;

export const SCORE_ATTRIBUTES = [
  'overall',
  'appearance',
  'aroma',
  'flavour',
  'texture',
  'finish',
] as const;
export type ScoreAttribute = (typeof SCORE_ATTRIBUTES)[number];

export const SCORE_ATTRIBUTE_LABELS: Record<ScoreAttribute, string> = {
  overall: 'Overall liking',
  appearance: 'Appearance',
  aroma: 'Aroma',
  flavour: 'Flavour',
  texture: 'Body and texture',
  finish: 'Finish',
};

/**
 * Flavour descriptors from the descriptive language for Cheddar cheese of M. A. Drake,
 * S. C. McIngvale, P. D. Gerard, K. R. Cadwallader and G. V. Civille, "Development of a
 * descriptive language for Cheddar cheese", Journal of Food Science 66(9), 1422-1427, 2001
 * (aromatics and basic tastes). Keys are ours; the terms are the lexicon's.
 */
export const FLAVOUR_DESCRIPTORS = [
  { key: 'cooked', label: 'Cooked' },
  { key: 'whey', label: 'Whey' },
  { key: 'diacetyl', label: 'Diacetyl (buttery)' },
  { key: 'milkfat', label: 'Milkfat / lactone' },
  { key: 'fruity', label: 'Fruity' },
  { key: 'sulfur', label: 'Sulfur' },
  { key: 'free-fatty-acid', label: 'Free fatty acid' },
  { key: 'brothy', label: 'Brothy' },
  { key: 'nutty', label: 'Nutty' },
  { key: 'catty', label: 'Catty' },
  { key: 'cowy', label: 'Cowy / phenolic' },
  { key: 'age', label: 'Age' },
  { key: 'yeasty', label: 'Yeasty' },
  { key: 'sweet', label: 'Sweet' },
  { key: 'sour', label: 'Sour' },
  { key: 'salty', label: 'Salty' },
  { key: 'bitter', label: 'Bitter' },
  { key: 'umami', label: 'Umami' },
] as const;

/**
 * Defects named by the judging references of the trade: the ADSA dairy-products scorecard
 * (Michigan State University Extension bulletin F0798) and the USDA grade standards for
 * Cheddar cheese (flavour; body and texture; colour; finish and appearance).
 */
export const DEFECTS = [
  { key: 'acid', label: 'Acid', group: 'flavour' },
  { key: 'bitter', label: 'Bitter', group: 'flavour' },
  { key: 'flat', label: 'Flat', group: 'flavour' },
  { key: 'fruity', label: 'Fruity / fermented', group: 'flavour' },
  { key: 'rancid', label: 'Rancid', group: 'flavour' },
  { key: 'unclean', label: 'Unclean', group: 'flavour' },
  { key: 'crumbly', label: 'Crumbly', group: 'body' },
  { key: 'mealy', label: 'Mealy', group: 'body' },
  { key: 'open', label: 'Open (mechanical openings)', group: 'body' },
  { key: 'pasty', label: 'Pasty', group: 'body' },
  { key: 'weak', label: 'Weak', group: 'body' },
  { key: 'mottled', label: 'Mottled', group: 'colour' },
  { key: 'seamy', label: 'Seamy', group: 'colour' },
] as const;

export type FlavourDescriptor = (typeof FLAVOUR_DESCRIPTORS)[number]['key'];
export type Defect = (typeof DEFECTS)[number]['key'];
