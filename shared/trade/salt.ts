// Salt, colouring and calcium chloride as rates: per litre of milk, per kilogram of curd, and
// salt as a share of the cheese. Rates keep the amount's dimension: g/L for a mass, mL/L for a
// volume, drops/L for a count of drops (drops are never turned into millilitres here).

import { milkMassKg } from './milk';
import type { MilkSpecies } from './milk';
import type { AmountDimension, SiAmount } from './units';

/** An amount per unit of milk or curd, in a practical unit for its dimension. */
export interface AmountRate {
  dimension: AmountDimension;
  value: number;
  unit: 'g/L' | 'mL/L' | 'drops/L' | 'g/kg' | 'mL/kg' | 'drops/kg';
}

function assertPositive(value: number, what: string): void {
  if (!Number.isFinite(value) || value <= 0) throw new RangeError(`${what} must be positive`);
}

function assertNonNegative(value: number, what: string): void {
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`${what} must be non-negative`);
}

// SI amounts are in L or kg; rates read better in mL and g.
function practicalValue(amount: SiAmount): number {
  return amount.dimension === 'count' ? amount.value : amount.value * 1000;
}

/** Returns an amount per litre of milk in g/L, mL/L or drops/L (definition of a rate). */
export function ratePerLitreOfMilk(amount: SiAmount, milkLitres: number): AmountRate {
  assertNonNegative(amount.value, 'Amount');
  assertPositive(milkLitres, 'Milk volume');
  const unit =
    amount.dimension === 'mass' ? 'g/L' : amount.dimension === 'volume' ? 'mL/L' : 'drops/L';
  return { dimension: amount.dimension, value: practicalValue(amount) / milkLitres, unit };
}

/** Returns an amount per kilogram of curd in g/kg, mL/kg or drops/kg (definition of a rate). */
export function ratePerKgOfCurd(amount: SiAmount, curdKg: number): AmountRate {
  assertNonNegative(amount.value, 'Amount');
  assertPositive(curdKg, 'Curd mass');
  const unit =
    amount.dimension === 'mass' ? 'g/kg' : amount.dimension === 'volume' ? 'mL/kg' : 'drops/kg';
  return { dimension: amount.dimension, value: practicalValue(amount) / curdKg, unit };
}

/** Returns salt as % of the curd or green-cheese mass (salt kg / curd kg × 100; definition). */
export function saltPercentOfCurd(saltKg: number, curdKg: number): number {
  assertNonNegative(saltKg, 'Salt mass');
  assertPositive(curdKg, 'Curd mass');
  return (saltKg / curdKg) * 100;
}

/** Returns the salt mass in kg for a curd mass at a salting rate in % of curd (definition). */
export function saltForCurdKg(curdKg: number, saltPercent: number): number {
  assertNonNegative(curdKg, 'Curd mass');
  assertNonNegative(saltPercent, 'Salt rate');
  return (curdKg * saltPercent) / 100;
}

/** Returns salt in moisture in % (salt % / moisture % × 100; cheese-science texts). */
export function saltInMoisturePercent(saltPercent: number, moisturePercent: number): number {
  assertNonNegative(saltPercent, 'Salt');
  assertPositive(moisturePercent, 'Moisture');
  return (saltPercent / moisturePercent) * 100;
}

/** Calcium chloride limit, % of the milk's weight as anhydrous CaCl2 (21 CFR 133.113). */
export const CALCIUM_CHLORIDE_MAX_PERCENT_OF_MILK = 0.02;

/** Returns the calcium chloride in a solution in kg (L × g per 100 mL; arithmetic). */
export function calciumChlorideFromSolutionKg(
  solutionLitres: number,
  gramsPer100mL: number,
): number {
  assertNonNegative(solutionLitres, 'Solution volume');
  if (!Number.isFinite(gramsPer100mL) || gramsPer100mL <= 0 || gramsPer100mL > 100) {
    throw new RangeError('Solution strength must be in (0, 100] g per 100 mL');
  }
  // L × 1000 mL/L × (g / 100 mL) / 1000 g/kg
  return (solutionLitres * gramsPer100mL) / 100;
}

export interface CalciumChlorideCheck {
  /** calcium chloride as % of the milk's weight */
  percentOfMilk: number;
  /** grams of calcium chloride per litre of milk */
  gramsPerLitre: number;
  /** largest amount allowed for this milk, kg */
  maxKg: number;
  limitPercent: number;
  withinLimit: boolean;
  source: string;
}

/** Returns calcium chloride as % of milk weight against the 0.02 % limit (21 CFR 133.113). */
export function checkCalciumChloride(
  calciumChlorideKg: number,
  milkLitres: number,
  species: MilkSpecies = 'cow',
): CalciumChlorideCheck {
  assertNonNegative(calciumChlorideKg, 'Calcium chloride mass');
  assertPositive(milkLitres, 'Milk volume');
  const milkKg = milkMassKg(milkLitres, species);
  const percentOfMilk = (calciumChlorideKg / milkKg) * 100;
  return {
    percentOfMilk,
    gramsPerLitre: (calciumChlorideKg * 1000) / milkLitres,
    maxKg: (milkKg * CALCIUM_CHLORIDE_MAX_PERCENT_OF_MILK) / 100,
    limitPercent: CALCIUM_CHLORIDE_MAX_PERCENT_OF_MILK,
    // A hair of tolerance so an amount worked out as exactly the limit is not refused.
    withinLimit: percentOfMilk <= CALCIUM_CHLORIDE_MAX_PERCENT_OF_MILK * (1 + 1e-9),
    source:
      '21 CFR 133.113 (cheddar cheese): at most 0.02 % of the weight of the milk, calculated ' +
      'as anhydrous calcium chloride',
  };
}
