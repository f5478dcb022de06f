/**
 * Cheese styles offered when a maker records a batch, grouped by family.
 * Typical aging ranges are broad common-practice figures recalled from general cheesemaking
 * texts ([memory]; no single published source): they only seed the aging plan, the maker
 * sets their own target.
 */
export const STYLE_FAMILIES = [
  'fresh',
  'soft-ripened',
  'washed-rind',
  'semi-hard',
  'hard',
  'blue',
  'pasta-filata',
  'brined',
  'whey',
] as const;

export type StyleFamily = (typeof STYLE_FAMILIES)[number];

export const STYLE_FAMILY_LABELS: Record<StyleFamily, string> = {
  fresh: 'Fresh',
  'soft-ripened': 'Soft, surface-ripened',
  'washed-rind': 'Washed rind',
  'semi-hard': 'Semi-hard',
  hard: 'Hard',
  blue: 'Blue',
  'pasta-filata': 'Pasta filata (stretched curd)',
  brined: 'Brined',
  whey: 'Whey cheese',
};

export type StyleDefinition = {
  slug: string;
  name: string;
  family: StyleFamily;
  description: string;
  agingDays: [number, number];
};

export const STYLES: readonly StyleDefinition[] = [
  {
    slug: 'cheddar',
    name: 'Cheddar',
    family: 'hard',
    description: 'Cut, cooked and cheddared curd, milled, dry-salted and pressed firmly.',
    agingDays: [60, 720],
  },
  {
    slug: 'stirred-curd-cheddar',
    name: 'Stirred-curd cheddar',
    family: 'hard',
    description:
      'Cheddar-type curd kept loose by stirring instead of being stacked in slabs, then salted and pressed.',
    agingDays: [60, 540],
  },
  {
    slug: 'cloth-bound-cheddar',
    name: 'Cloth-bound cheddar',
    family: 'hard',
    description: 'Traditional cheddar bandaged in larded cloth and aged on the shelf.',
    agingDays: [180, 720],
  },
  {
    slug: 'colby',
    name: 'Colby-type washed curd',
    family: 'semi-hard',
    description: 'Curd washed with cool water to lower acidity, giving a mild, open, moist cheese.',
    agingDays: [30, 90],
  },
  {
    slug: 'monterey-jack',
    name: 'Jack-type',
    family: 'semi-hard',
    description: 'Mild washed-curd cheese, lightly pressed, eaten young or aged dry.',
    agingDays: [30, 180],
  },
  {
    slug: 'gouda',
    name: 'Gouda-type',
    family: 'semi-hard',
    description: 'Washed curd, pressed under whey, brined and usually waxed or coated.',
    agingDays: [30, 365],
  },
  {
    slug: 'edam',
    name: 'Edam-type',
    family: 'semi-hard',
    description: 'Low-fat washed-curd ball, brined and coated.',
    agingDays: [30, 180],
  },
  {
    slug: 'caerphilly',
    name: 'Caerphilly-type',
    family: 'semi-hard',
    description: 'Lightly pressed, quickly made crumbly cheese, brined and eaten young.',
    agingDays: [14, 90],
  },
  {
    slug: 'alpine',
    name: 'Alpine-type',
    family: 'hard',
    description: 'Finely cut curd cooked high, pressed and aged with a washed or brushed rind.',
    agingDays: [120, 720],
  },
  {
    slug: 'swiss-eye',
    name: 'Swiss-type with eyes',
    family: 'hard',
    description: 'Cooked curd with propionic cultures, warm-room step to form eyes.',
    agingDays: [90, 365],
  },
  {
    slug: 'grana',
    name: 'Grana-type',
    family: 'hard',
    description: 'Part-skimmed milk, very fine curd cooked high, long-aged for grating.',
    agingDays: [270, 1095],
  },
  {
    slug: 'pecorino',
    name: 'Pecorino-type (sheep)',
    family: 'hard',
    description: "Sheep's milk curd, cooked moderately, dry-salted or brined and aged.",
    agingDays: [60, 365],
  },
  {
    slug: 'manchego',
    name: 'Manchego-type (sheep)',
    family: 'hard',
    description: "Pressed sheep's milk cheese with a basket-patterned rind.",
    agingDays: [60, 365],
  },
  {
    slug: 'tomme',
    name: 'Tomme-type',
    family: 'semi-hard',
    description: 'Rustic natural-rind mountain cheese, lightly cooked and pressed.',
    agingDays: [60, 180],
  },
  {
    slug: 'havarti',
    name: 'Havarti-type',
    family: 'semi-hard',
    description: 'Washed curd, lightly pressed, with small irregular openings.',
    agingDays: [30, 90],
  },
  {
    slug: 'camembert',
    name: 'Camembert-type',
    family: 'soft-ripened',
    description: 'Unpressed, ladled curd ripened by a white surface mould.',
    agingDays: [21, 60],
  },
  {
    slug: 'brie',
    name: 'Brie-type',
    family: 'soft-ripened',
    description: 'Large, flat, bloomy-rind wheel ripened from the surface inward.',
    agingDays: [28, 70],
  },
  {
    slug: 'lactic-goat',
    name: 'Lactic goat cheese',
    family: 'soft-ripened',
    description: "Slow lactic set goat's milk curd, often ashed, with a wrinkled or bloomy rind.",
    agingDays: [10, 45],
  },
  {
    slug: 'washed-rind-soft',
    name: 'Soft washed-rind',
    family: 'washed-rind',
    description: 'Supple cheese washed in brine to grow an orange, pungent smear.',
    agingDays: [30, 90],
  },
  {
    slug: 'washed-rind-semi',
    name: 'Semi-soft washed-rind',
    family: 'washed-rind',
    description: 'Pressed or semi-pressed wheel with a brine-washed smear rind.',
    agingDays: [45, 120],
  },
  {
    slug: 'stilton-type',
    name: 'Stilton-type blue',
    family: 'blue',
    description: 'Unpressed, milled curd with blue mould, pierced to let air in.',
    agingDays: [60, 150],
  },
  {
    slug: 'gorgonzola-type',
    name: 'Gorgonzola-type blue',
    family: 'blue',
    description: 'Soft, moist blue with a two-curd tradition, pierced during aging.',
    agingDays: [60, 120],
  },
  {
    slug: 'mozzarella',
    name: 'Mozzarella',
    family: 'pasta-filata',
    description: 'Acidified curd stretched in hot water and shaped, eaten fresh.',
    agingDays: [0, 7],
  },
  {
    slug: 'provolone',
    name: 'Provolone-type',
    family: 'pasta-filata',
    description: 'Stretched curd, brined, hung and aged, sometimes smoked.',
    agingDays: [60, 365],
  },
  {
    slug: 'halloumi',
    name: 'Halloumi-type',
    family: 'brined',
    description:
      'Pressed curd poached in whey, folded and kept in brine; holds its shape when grilled.',
    agingDays: [0, 60],
  },
  {
    slug: 'feta',
    name: 'Feta-type',
    family: 'brined',
    description: 'Unpressed curd cut in blocks, salted and matured in brine.',
    agingDays: [30, 90],
  },
  {
    slug: 'queso-fresco',
    name: 'Queso fresco',
    family: 'fresh',
    description: 'Fresh pressed curd, salted in the curd and eaten within days.',
    agingDays: [0, 10],
  },
  {
    slug: 'chevre-fresh',
    name: 'Fresh goat curd',
    family: 'fresh',
    description: "Lactic set goat's milk curd, drained in cloth or moulds, eaten fresh.",
    agingDays: [0, 10],
  },
  {
    slug: 'fromage-blanc',
    name: 'Fromage blanc',
    family: 'fresh',
    description: 'Soft, spoonable cultured curd drained lightly.',
    agingDays: [0, 7],
  },
  {
    slug: 'paneer',
    name: 'Paneer',
    family: 'fresh',
    description: 'Heat-and-acid set curd pressed into a firm block; not ripened.',
    agingDays: [0, 5],
  },
  {
    slug: 'cottage',
    name: 'Cottage cheese',
    family: 'fresh',
    description: 'Cut, cooked and washed curd kept as loose pieces.',
    agingDays: [0, 10],
  },
  {
    slug: 'ricotta',
    name: 'Ricotta',
    family: 'whey',
    description: 'Whey proteins gathered by heat and acid from sweet whey.',
    agingDays: [0, 5],
  },
  {
    slug: 'other',
    name: 'Other or own style',
    family: 'semi-hard',
    description: 'A style not listed here; describe it in the journal.',
    agingDays: [0, 365],
  },
];
