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
 * (aromatics and basic tastes). Keys are ours; the terms are the lexicon's. The one-line
 * `hint` under each term is our plain wording of what the term means [memory: written from
 * recollection of the lexicon's definitions and references, not copied from the paper].
 */
export const FLAVOUR_DESCRIPTORS = [
  { key: 'cooked', label: 'Cooked', hint: 'Like heated or boiled milk.' },
  { key: 'whey', label: 'Whey', hint: 'Like fresh whey: the young, milky-sour smell of the vat.' },
  {
    key: 'diacetyl',
    label: 'Diacetyl (buttery)',
    hint: 'Buttery, like butter or buttered popcorn.',
  },
  {
    key: 'milkfat',
    label: 'Milkfat / lactone',
    hint: 'Rich, creamy, like cream or butterfat; slightly coconut-like.',
  },
  { key: 'fruity', label: 'Fruity', hint: 'Like fresh or fermented fruit: pineapple, apple.' },
  { key: 'sulfur', label: 'Sulfur', hint: 'Like a struck match or cooked egg.' },
  {
    key: 'free-fatty-acid',
    label: 'Free fatty acid',
    hint: 'Sharp, soapy or goaty: fats broken down as the cheese ages.',
  },
  { key: 'brothy', label: 'Brothy', hint: 'Savoury, like meat or vegetable stock.' },
  { key: 'nutty', label: 'Nutty', hint: 'Like roasted nuts, hazelnut or walnut.' },
  {
    key: 'catty',
    label: 'Catty',
    hint: 'A sharp sulfur note like tomato leaves or cat urine; small amounts are typical of aged cheddar.',
  },
  {
    key: 'cowy',
    label: 'Cowy / phenolic',
    hint: 'Barny: like a cow shed or a plaster bandage.',
  },
  { key: 'age', label: 'Age', hint: 'The deep, complex taste of a long-aged cheese.' },
  { key: 'yeasty', label: 'Yeasty', hint: 'Like bread dough or fresh yeast.' },
  { key: 'sweet', label: 'Sweet', hint: 'The basic taste of sugar.' },
  { key: 'sour', label: 'Sour', hint: 'The basic taste of acid, like lemon juice.' },
  { key: 'salty', label: 'Salty', hint: 'The basic taste of salt.' },
  { key: 'bitter', label: 'Bitter', hint: 'The basic taste of strong coffee or tonic water.' },
  { key: 'umami', label: 'Umami', hint: 'The savoury basic taste of broth or soy sauce.' },
] as const;

/**
 * Defects named by the judging references of the trade: the ADSA dairy-products scorecard
 * (Michigan State University Extension bulletin F0798) and the USDA grade standards for
 * Cheddar cheese (flavour; body and texture; colour; finish and appearance). Those lists are
 * written for Cheddar: `typicalIn` names the Rindwise styles (slugs of
 * shared/constants/styles.ts) where the trait is the style's own and so not a defect (common
 * practice, no published source). Each `hint` is our plain wording [memory].
 */
export const DEFECTS = [
  {
    key: 'acid',
    label: 'Acid',
    group: 'flavour',
    hint: 'Too sour: a sharp, lingering acid taste.',
    typicalIn: ['lactic-goat', 'chevre-fresh', 'fromage-blanc'],
  },
  {
    key: 'bitter',
    label: 'Bitter',
    group: 'flavour',
    hint: 'A bitter aftertaste at the back of the tongue.',
    typicalIn: [],
  },
  {
    key: 'flat',
    label: 'Flat',
    group: 'flavour',
    hint: 'Little or no flavour: bland for its age.',
    typicalIn: [],
  },
  {
    key: 'fruity',
    label: 'Fruity / fermented',
    group: 'flavour',
    hint: 'Too much fruit or fermented smell in a style that should be clean.',
    typicalIn: [],
  },
  {
    key: 'rancid',
    label: 'Rancid',
    group: 'flavour',
    hint: 'Soapy, bitter or spoiled-butter taste from broken-down fat.',
    typicalIn: [],
  },
  {
    key: 'unclean',
    label: 'Unclean',
    group: 'flavour',
    hint: 'A dirty or stale aftertaste that lingers.',
    typicalIn: [],
  },
  {
    key: 'crumbly',
    label: 'Crumbly',
    group: 'body',
    hint: 'Falls apart when cut or rolled between the fingers.',
    typicalIn: ['caerphilly', 'feta', 'stilton-type', 'lactic-goat', 'queso-fresco', 'grana'],
  },
  {
    key: 'mealy',
    label: 'Mealy',
    group: 'body',
    hint: 'Grainy in the mouth, like flour or corn meal.',
    typicalIn: [],
  },
  {
    key: 'open',
    label: 'Open (mechanical openings)',
    group: 'body',
    hint: 'Irregular holes or slits between curd pieces that did not knit.',
    typicalIn: ['stilton-type', 'gorgonzola-type', 'havarti'],
  },
  {
    key: 'pasty',
    label: 'Pasty',
    group: 'body',
    hint: 'Soft and sticky, smears like paste when rubbed.',
    typicalIn: ['camembert', 'brie', 'washed-rind-soft'],
  },
  {
    key: 'weak',
    label: 'Weak',
    group: 'body',
    hint: 'Too soft: gives way with little pressure.',
    typicalIn: ['camembert', 'brie', 'washed-rind-soft', 'fromage-blanc', 'chevre-fresh'],
  },
  {
    key: 'mottled',
    label: 'Mottled',
    group: 'colour',
    hint: 'Uneven colour: lighter and darker patches in the paste.',
    typicalIn: ['stilton-type', 'gorgonzola-type'],
  },
  {
    key: 'seamy',
    label: 'Seamy',
    group: 'colour',
    hint: 'Pale lines where curd pieces joined, seen on the cut face.',
    typicalIn: [],
  },
] as const satisfies readonly {
  key: string;
  label: string;
  group: 'flavour' | 'body' | 'colour';
  hint: string;
  typicalIn: readonly string[];
}[];

/** The defects that are not defects for a style, because the trait is the style's own. */
export function typicalTraitsOf(styleSlug: string | null | undefined): Set<string> {
  return new Set(
    DEFECTS.filter((d) => (d.typicalIn as readonly string[]).includes(styleSlug ?? '')).map(
      (d) => d.key,
    ),
  );
}

export type FlavourDescriptor = (typeof FLAVOUR_DESCRIPTORS)[number]['key'];
export type Defect = (typeof DEFECTS)[number]['key'];
