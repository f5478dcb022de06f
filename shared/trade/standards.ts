// The US standard of identity for cheddar, for showing a batch's figures beside the limits.
// Rindwise records are not a compliance test: these are reference lines, and local and
// national rules elsewhere differ (Codex Alimentarius CXS 263-1966 is the international one).

import { CALCIUM_CHLORIDE_MAX_PERCENT_OF_MILK } from './salt';
import { RAW_MILK_MIN_AGING_DAYS, RAW_MILK_MIN_AGING_TEMP_C } from './aging';

/** Limits of the cheddar standard of identity (21 CFR 133.113). */
export const CHEDDAR_STANDARD = {
  /** moisture at most 39 % by weight */
  maxMoisturePercent: 39,
  /** milkfat at least 50 % of the solids */
  minFatInDryMatterPercent: 50,
  /** unpasteurised milk: aged at least 60 days */
  minAgingDaysUnpasteurised: RAW_MILK_MIN_AGING_DAYS,
  /** ... at no less than 35 °F */
  minAgingTempC: RAW_MILK_MIN_AGING_TEMP_C,
  /** calcium chloride at most 0.02 % of the milk's weight */
  maxCalciumChloridePercentOfMilk: CALCIUM_CHLORIDE_MAX_PERCENT_OF_MILK,
  source: '21 CFR 133.113, Cheddar cheese',
} as const;

/** Returns fat in dry matter, % of the solids (fat % / (100 − moisture %) × 100; definition). */
export function fatInDryMatterPercent(fatPercent: number, moisturePercent: number): number {
  if (!Number.isFinite(fatPercent) || fatPercent < 0 || fatPercent > 100) {
    throw new RangeError('Fat must be a percentage');
  }
  if (!Number.isFinite(moisturePercent) || moisturePercent < 0 || moisturePercent >= 100) {
    throw new RangeError('Moisture must be a percentage below 100');
  }
  if (fatPercent > 100 - moisturePercent) {
    throw new RangeError('Fat cannot exceed the solids');
  }
  return (fatPercent / (100 - moisturePercent)) * 100;
}

export interface CheddarStandardCheck {
  moisturePercent: number;
  moistureWithinLimit: boolean;
  /** present when the cheese's fat % was given */
  fatInDryMatterPercent: number | null;
  fatWithinLimit: boolean | null;
  /** false when any given figure is outside the standard */
  meetsStandard: boolean;
  source: string;
}

/** Returns moisture and fat in solids checked against the cheddar limits (21 CFR 133.113). */
export function checkCheddarStandard(cheese: {
  /** moisture of the cheese, % by weight */
  moisturePercent: number;
  /** fat of the cheese, % by weight, when measured */
  fatPercent?: number;
}): CheddarStandardCheck {
  const { moisturePercent, fatPercent } = cheese;
  if (!Number.isFinite(moisturePercent) || moisturePercent < 0 || moisturePercent >= 100) {
    throw new RangeError('Moisture must be a percentage below 100');
  }
  const moistureWithinLimit = moisturePercent <= CHEDDAR_STANDARD.maxMoisturePercent;
  const fdm = fatPercent === undefined ? null : fatInDryMatterPercent(fatPercent, moisturePercent);
  const fatWithinLimit = fdm === null ? null : fdm >= CHEDDAR_STANDARD.minFatInDryMatterPercent;
  return {
    moisturePercent,
    moistureWithinLimit,
    fatInDryMatterPercent: fdm,
    fatWithinLimit,
    meetsStandard: moistureWithinLimit && fatWithinLimit !== false,
    source: CHEDDAR_STANDARD.source,
  };
}
