// Cheese yield: what the vat gave, what the milk should give, and how the two compare.

/**
 * Constants of Van Slyke's cheddar yield formula (L. L. Van Slyke and W. V. Price, "Cheese",
 * 1949): share of the milk fat retained in the curd, casein lost to the whey (percentage
 * points), and the factor for salt and other solids carried into the cheese.
 */
export const VAN_SLYKE = {
  fatRetained: 0.93,
  caseinLost: 0.1,
  otherSolidsFactor: 1.09,
} as const;

/** Share of true milk protein that is casein, about 0.78 [memory, general dairy-science texts]. */
export const DEFAULT_CASEIN_FRACTION = 0.78;

function assertPositive(value: number, what: string): void {
  if (!Number.isFinite(value) || value <= 0) throw new RangeError(`${what} must be positive`);
}

function assertNonNegative(value: number, what: string): void {
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`${what} must be non-negative`);
}

function assertPercent(value: number, what: string): void {
  if (!Number.isFinite(value) || value < 0 || value >= 100) {
    throw new RangeError(`${what} must be a percentage from 0 up to (not including) 100`);
  }
}

/** Returns the actual yield as % of milk mass (cheese kg / milk kg × 100; TRADE.md, definition). */
export function yieldPercent(cheeseKg: number, milkKg: number): number {
  assertNonNegative(cheeseKg, 'Cheese mass');
  assertPositive(milkKg, 'Milk mass');
  return (cheeseKg / milkKg) * 100;
}

/** Returns the actual yield in kg of cheese per 100 kg of milk (same number as %; definition). */
export function yieldKgPer100KgMilk(cheeseKg: number, milkKg: number): number {
  return yieldPercent(cheeseKg, milkKg);
}

/** Returns milk casein % from true protein % × casein fraction (default 0.78 [memory]). */
export function caseinFromProtein(
  proteinPercent: number,
  caseinFraction: number = DEFAULT_CASEIN_FRACTION,
): number {
  assertPercent(proteinPercent, 'Protein');
  if (!Number.isFinite(caseinFraction) || caseinFraction <= 0 || caseinFraction > 1) {
    throw new RangeError('Casein fraction must be in (0, 1]');
  }
  return proteinPercent * caseinFraction;
}

/** Milk composition and target moisture for the Van Slyke prediction. */
export type VanSlykeInput = {
  /** milk fat, % by mass */
  fatPercent: number;
  /** moisture of the finished cheese, % by mass */
  moisturePercent: number;
} & (
  | { /** milk casein, % by mass */ caseinPercent: number }
  | {
      /** milk true protein, % by mass */
      proteinPercent: number;
      /** share of the protein that is casein; default 0.78 [memory] */
      caseinFraction?: number;
    }
);

/** Returns the Van Slyke cheddar yield in kg cheese per 100 kg milk (Van Slyke & Price 1949). */
export function vanSlykeYield(input: VanSlykeInput): number {
  assertPercent(input.fatPercent, 'Fat');
  assertPercent(input.moisturePercent, 'Moisture');
  const casein =
    'caseinPercent' in input
      ? input.caseinPercent
      : caseinFromProtein(input.proteinPercent, input.caseinFraction);
  assertPercent(casein, 'Casein');
  const { fatRetained, caseinLost, otherSolidsFactor } = VAN_SLYKE;
  const solids = (fatRetained * input.fatPercent + casein - caseinLost) * otherSolidsFactor;
  return solids / (1 - input.moisturePercent / 100);
}

/** Returns the cheese mass in kg for a milk mass at a yield in kg/100 kg (definition). */
export function predictedCheeseKg(milkKg: number, yieldPer100Kg: number): number {
  assertNonNegative(milkKg, 'Milk mass');
  assertNonNegative(yieldPer100Kg, 'Yield');
  return (milkKg * yieldPer100Kg) / 100;
}

/** Returns yield efficiency = actual / predicted (ratio, 1 = as predicted; TRADE.md definition). */
export function yieldEfficiency(actualYield: number, predictedYield: number): number {
  assertNonNegative(actualYield, 'Actual yield');
  assertPositive(predictedYield, 'Predicted yield');
  return actualYield / predictedYield;
}
