// Milk: from the volume a maker measures to the mass every yield and rate is based on.

export const MILK_SPECIES = ['cow', 'goat', 'sheep', 'buffalo', 'other'] as const;
export type MilkSpecies = (typeof MILK_SPECIES)[number];

/** Density of whole cow's milk at 20 °C in kg/L (H. D. Goff, Dairy Science, U. of Guelph). */
export const COW_MILK_DENSITY_KG_PER_L = 1.03;

export interface MilkDensity {
  /** kg per litre at about 20 °C */
  kgPerL: number;
  /** true when no published value for the species was at hand and cow's milk stands in */
  assumed: boolean;
  source: string;
}

const COW_SOURCE =
  "Whole cow's milk at 20 °C: H. D. Goff, Dairy Science and Technology Education (University " +
  'of Guelph); P. F. Fox and P. L. H. McSweeney, Advanced Dairy Chemistry vol. 3';

// Goat, sheep and buffalo milk differ from cow's milk mostly in fat and protein, so their
// densities sit close to it, but no published figure was at hand when this was written.
// Until one is, they use the cow value with the substitution flagged, so a screen can say
// the milk mass is an estimate.
const ASSUMED_SOURCE =
  "No published density at hand for this species; cow's milk value used (common practice)";

/** Returns the density of the species' milk at about 20 °C in kg/L, with its source (see above). */
export function milkDensity(species: MilkSpecies = 'cow'): MilkDensity {
  if (species === 'cow') {
    return { kgPerL: COW_MILK_DENSITY_KG_PER_L, assumed: false, source: COW_SOURCE };
  }
  return { kgPerL: COW_MILK_DENSITY_KG_PER_L, assumed: true, source: ASSUMED_SOURCE };
}

function assertVolume(litres: number): void {
  if (!Number.isFinite(litres) || litres < 0) {
    throw new RangeError('Milk volume must be a non-negative number of litres');
  }
}

/** Returns the mass of a volume of milk in kg (density at 20 °C; Goff, Guelph; see milkDensity). */
export function milkMassKg(litres: number, species: MilkSpecies = 'cow', kgPerL?: number): number {
  assertVolume(litres);
  const density = kgPerL ?? milkDensity(species).kgPerL;
  if (!(density > 0)) throw new RangeError('Milk density must be positive');
  return litres * density;
}

/** Returns the volume of a mass of milk in litres (density at 20 °C; see milkDensity). */
export function milkVolumeLitres(
  kg: number,
  species: MilkSpecies = 'cow',
  kgPerL?: number,
): number {
  if (!Number.isFinite(kg) || kg < 0) {
    throw new RangeError('Milk mass must be a non-negative number of kilograms');
  }
  const density = kgPerL ?? milkDensity(species).kgPerL;
  if (!(density > 0)) throw new RangeError('Milk density must be positive');
  return kg / density;
}
