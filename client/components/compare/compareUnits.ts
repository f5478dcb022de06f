// Compare's values arrive in SI; these turn them into the reader's units. A scale is linear
// (display = factor × SI + offset), so a slope converts by the factor alone: per °F rather
// than per °C, per psi rather than per kPa, per ounce per gallon rather than per gram per litre.

import {
  COMPARE_OUTCOMES,
  COMPARE_PARAMETERS,
  type CompareOutcomeKey,
  type CompareParameterKey,
} from '@shared/constants/compare';
import {
  deltaFromCelsius,
  formatNumber,
  formatPressure,
  formatTemperature,
  formatTemperatureDelta,
  formatVolume,
  fromCelsius,
  fromKilopascals,
  KILOGRAMS_PER,
  LITRES_PER,
  type UnitSystem,
} from '@shared/trade';
import {
  formatDate,
  formatMassPerMilk,
  formatPercent,
  formatVolumePerMilk,
} from '../../composables/journalDisplay';

/** How SI values of one quantity show in the reader's units. */
export type DisplayScale = {
  /** The SI value in display units. */
  convert: (si: number) => number;
  /** Display units per SI unit: what a slope per SI unit is divided by. */
  factor: number;
  /** The unit shown after numbers and in axis names, e.g. "°F" or "oz/gal"; '' for none. */
  symbol: string;
};

// g/L → oz per US gallon and mL/L → tsp per US gallon, as the journal page shows rates.
const OZ_PER_GAL_PER_G_PER_L = LITRES_PER.gal / (KILOGRAMS_PER.oz * 1000);
const TSP_PER_GAL_PER_ML_PER_L = LITRES_PER.gal / (LITRES_PER.tsp * 1000);

const identity = (symbol: string): DisplayScale => ({ convert: (v) => v, factor: 1, symbol });
const linear = (factor: number, symbol: string): DisplayScale => ({
  convert: (v) => v * factor,
  factor,
  symbol,
});

/** The display scale for a value of this kind and SI unit in the reader's unit system. */
export function scaleFor(kind: string, unit: string | null, system: UnitSystem): DisplayScale {
  const us = system === 'us';
  if (kind === 'temperature')
    return us ? { convert: (v) => fromCelsius(v, 'F'), factor: 1.8, symbol: '°F' } : identity('°C');
  if (kind === 'temperature-rate')
    return us
      ? { convert: (v) => deltaFromCelsius(v, 'F'), factor: 1.8, symbol: '°F per 5 min' }
      : identity('°C per 5 min');
  if (kind === 'pressure') return us ? linear(fromKilopascals(1, 'psi'), 'psi') : identity('kPa');
  if (unit === 'g/L') return us ? linear(OZ_PER_GAL_PER_G_PER_L, 'oz/gal') : identity('g/L');
  if (unit === 'mL/L') return us ? linear(TSP_PER_GAL_PER_ML_PER_L, 'tsp/gal') : identity('mL/L');
  return identity(unit ?? '');
}

export type ParameterInfo = (typeof COMPARE_PARAMETERS)[number];
export type OutcomeInfo = (typeof COMPARE_OUTCOMES)[number];

/** The parameter with this key. */
export const parameterOf = (key: CompareParameterKey): ParameterInfo =>
  COMPARE_PARAMETERS.find((p) => p.key === key)!;

/** The outcome with this key. */
export const outcomeOf = (key: CompareOutcomeKey): OutcomeInfo =>
  COMPARE_OUTCOMES.find((o) => o.key === key)!;

/** The parameter's display scale in the reader's units (identity for categories). */
export const parameterScale = (key: CompareParameterKey, system: UnitSystem): DisplayScale => {
  const p = parameterOf(key);
  return scaleFor(p.kind, p.unit, system);
};

/** A label in the reader's units: "Salt per gallon of milk" for US readers. */
export function labelFor(label: string, system: UnitSystem): string {
  return system === 'us' ? label.replace(/per litre/g, 'per gallon') : label;
}

/** The parameter's plain name in the reader's units. */
export const parameterLabel = (key: CompareParameterKey, system: UnitSystem): string =>
  labelFor(parameterOf(key).label, system);

/** True for outcomes measured once per batch (yield, weight loss), not per tasting. */
export const isBatchOutcome = (key: CompareOutcomeKey): boolean =>
  outcomeOf(key).level === 'journal';

/** A value already in display units with its symbol, e.g. "2.4 g/L", "101.3 °F", "6.5". */
export function formatWithSymbol(value: number, symbol: string, significant = 3): string {
  const shown = formatNumber(value, { significant, maxDecimals: 3 });
  if (!symbol || symbol === '1–9') return shown;
  if (symbol === '%' || symbol.startsWith('% ')) return `${shown} %`;
  if (symbol === 'days') return `${shown} ${shown === '1' ? 'day' : 'days'}`;
  return `${shown} ${symbol}`;
}

/** An SI value of a parameter as text in the reader's units. */
export function formatParameter(key: CompareParameterKey, si: number, system: UnitSystem): string {
  const scale = parameterScale(key, system);
  return formatWithSymbol(scale.convert(si), scale.symbol);
}

/** An outcome value as text: a score with one decimal, a percentage with one. */
export function formatOutcome(key: CompareOutcomeKey, value: number): string {
  const o = outcomeOf(key);
  const rounded = Math.round(value * 10) / 10;
  if (o.unit === '1–9') return rounded.toFixed(Number.isInteger(value) ? 0 : 1);
  return `${rounded.toFixed(1)} %`;
}

/** A unit for an axis name or a picker: "(g/L)", "(°F)", "(1–9)"; '' when there is none. */
export const unitInBrackets = (symbol: string): string => (symbol ? ` (${symbol})` : '');

/**
 * One value of the side-by-side table as text in the reader's units: temperatures, ramps,
 * pressures, milk volumes and rates per milk converted; dates in words; '–' when not recorded.
 */
export function formatSideValue(
  row: { kind: string; unit: string | null },
  value: number | string | null,
  system: UnitSystem,
): string {
  if (value === null || value === '') return '–';
  if (typeof value === 'string') return row.kind === 'date' ? formatDate(value) : value;
  if (row.kind === 'temperature') return formatTemperature(value, system);
  if (row.kind === 'temperature-rate') return `${formatTemperatureDelta(value, system)} per 5 min`;
  if (row.kind === 'pressure') return formatPressure(value, system);
  if (row.kind === 'volume') return formatVolume(value, system);
  switch (row.unit) {
    case 'g/L':
      return formatMassPerMilk(value, system);
    case 'mL/L':
      return formatVolumePerMilk(value, system);
    case '%':
    case '% of milk weight':
      return formatPercent(value);
    case 'days':
      return `${formatNumber(value)} ${value === 1 ? 'day' : 'days'}`;
    case 'kg per 100 kg milk':
      return `${value.toFixed(1)} kg per 100 kg of milk`;
    case '1–9':
      return value.toFixed(1);
    default:
      return formatNumber(value);
  }
}
