// Display strings for the member's unit system. Numbers keep three significant digits by
// default (never fewer than the integer part), trailing zeros are dropped, and a space
// separates number and unit symbol, as NIST SP 811 §7.2 asks (also before °C and °F).
// Display units are chosen so the number reads naturally: 500 mL rather than 0.5 L,
// 2 qt rather than 0.5 gal, 6 oz rather than 0.375 lb.

import {
  deltaFromCelsius,
  fromCelsius,
  fromKilograms,
  fromKilopascals,
  fromLitres,
  fromMillimetres,
  fromNewtons,
  KILOGRAMS_PER,
  LITRES_PER,
  amountDimension,
} from './units';
import type {
  AmountUnit,
  ForceUnit,
  LengthUnit,
  MassUnit,
  PressureUnit,
  SiAmount,
  TemperatureUnit,
  UnitSystem,
  VolumeUnit,
} from './units';

export interface NumberFormatOptions {
  /** Significant digits kept (default 3); the integer part is never rounded away. */
  significant?: number;
  /** Upper bound on decimals shown (default 3). */
  maxDecimals?: number;
}

/** Returns a number rounded for display, without trailing zeros or exponent (common practice). */
export function formatNumber(value: number, options: NumberFormatOptions = {}): string {
  if (!Number.isFinite(value)) return '–';
  const significant = options.significant ?? 3;
  const maxDecimals = options.maxDecimals ?? 3;
  if (value === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  const decimals = Math.min(maxDecimals, Math.max(0, significant - 1 - magnitude));
  let text = value.toFixed(decimals);
  if (text.includes('.')) text = text.replace(/0+$/, '').replace(/\.$/, '');
  // -0.0001 rounded to "−0" reads as a sign error: show plain zero.
  if (/^-0$/.test(text)) return '0';
  return text;
}

/** Symbols shown after a number, by unit key (NIST SP 811 symbols; US abbreviations). */
export const UNIT_SYMBOLS: Readonly<Record<string, string>> = {
  L: 'L',
  mL: 'mL',
  gal: 'gal',
  qt: 'qt',
  cup: 'cup',
  tbsp: 'tbsp',
  tsp: 'tsp',
  kg: 'kg',
  g: 'g',
  lb: 'lb',
  oz: 'oz',
  C: '°C',
  F: '°F',
  mm: 'mm',
  cm: 'cm',
  in: 'in',
  N: 'N',
  // Makers load a press with weights and think of the load in kg or lb.
  kgf: 'kg',
  lbf: 'lb',
  kPa: 'kPa',
  psi: 'psi',
  drop: 'drop',
};

function symbolFor(unit: string, shown: string): string {
  // Only the two words get a plural; abbreviations like "tbsp" do not.
  if ((unit === 'cup' || unit === 'drop') && shown !== '1') return `${UNIT_SYMBOLS[unit]}s`;
  return UNIT_SYMBOLS[unit] ?? unit;
}

/** Returns a value already in `unit` with its symbol, e.g. "1 tbsp" (common practice). */
export function formatQuantity(
  value: number,
  unit: string,
  options: NumberFormatOptions = {},
): string {
  const shown = formatNumber(value, options);
  return `${shown} ${symbolFor(unit, shown)}`;
}

/** Returns the volume unit a volume in litres reads best in for the system (common practice). */
export function displayVolumeUnit(litres: number, system: UnitSystem): VolumeUnit {
  const v = Math.abs(litres);
  if (system === 'metric') return v >= 1 ? 'L' : 'mL';
  if (v >= LITRES_PER.gal * 0.999) return 'gal';
  if (v >= LITRES_PER.qt * 0.999) return 'qt';
  if (v >= LITRES_PER.cup * 0.25 * 0.999) return 'cup';
  if (v >= LITRES_PER.tbsp * 0.999) return 'tbsp';
  return 'tsp';
}

/** Returns the mass unit a mass in kilograms reads best in for the system (common practice). */
export function displayMassUnit(kg: number, system: UnitSystem): MassUnit {
  const v = Math.abs(kg);
  if (system === 'metric') return v >= 1 ? 'kg' : 'g';
  return v >= KILOGRAMS_PER.lb * 0.999 ? 'lb' : 'oz';
}

/** Returns the length unit a length in millimetres reads best in (common practice). */
export function displayLengthUnit(mm: number, system: UnitSystem): LengthUnit {
  if (system === 'us') return 'in';
  return Math.abs(mm) >= 10 ? 'cm' : 'mm';
}

/** Returns a volume in litres as display text, e.g. "3.79 L" or "1 gal" (common practice). */
export function formatVolume(litres: number, system: UnitSystem, unit?: VolumeUnit): string {
  const shownUnit = unit ?? displayVolumeUnit(litres, system);
  return formatQuantity(fromLitres(litres, shownUnit), shownUnit);
}

/** Returns a mass in kilograms as display text, e.g. "8.6 lb" or "450 g" (common practice). */
export function formatMass(kg: number, system: UnitSystem, unit?: MassUnit): string {
  const shownUnit = unit ?? displayMassUnit(kg, system);
  return formatQuantity(fromKilograms(kg, shownUnit), shownUnit);
}

function temperatureUnitFor(system: UnitSystem): TemperatureUnit {
  return system === 'us' ? 'F' : 'C';
}

/** Returns a temperature in °C as display text to 0.1 degree, e.g. "100 °F" (common practice). */
export function formatTemperature(celsius: number, system: UnitSystem): string {
  const unit = temperatureUnitFor(system);
  return formatQuantity(fromCelsius(celsius, unit), unit, { significant: 16, maxDecimals: 1 });
}

/** Returns a temperature difference in °C as display text, e.g. "2 °F" (no offset; NIST SP 811). */
export function formatTemperatureDelta(deltaC: number, system: UnitSystem): string {
  const unit = temperatureUnitFor(system);
  return formatQuantity(deltaFromCelsius(deltaC, unit), unit, { significant: 16, maxDecimals: 1 });
}

/** Returns a length in millimetres as display text, e.g. "20.3 cm" or "8 in" (common practice). */
export function formatLength(mm: number, system: UnitSystem, unit?: LengthUnit): string {
  const shownUnit = unit ?? displayLengthUnit(mm, system);
  return formatQuantity(fromMillimetres(mm, shownUnit), shownUnit);
}

/** Returns a press load in newtons as display text in kg or lb of weight (common practice). */
export function formatLoad(newtons: number, system: UnitSystem): string {
  const unit: ForceUnit = system === 'us' ? 'lbf' : 'kgf';
  return formatQuantity(fromNewtons(newtons, unit), unit);
}

/** Returns a pressure in kPa as display text, e.g. "6.86 kPa" or "0.995 psi" (common practice). */
export function formatPressure(kPa: number, system: UnitSystem): string {
  const unit: PressureUnit = system === 'us' ? 'psi' : 'kPa';
  return formatQuantity(fromKilopascals(kPa, unit), unit);
}

/** Returns an SI amount (L, kg or drops) as display text; drops stay drops (common practice). */
export function formatAmount(amount: SiAmount, system: UnitSystem): string {
  if (amount.dimension === 'volume') return formatVolume(amount.value, system);
  if (amount.dimension === 'mass') return formatMass(amount.value, system);
  return formatQuantity(amount.value, 'drop');
}

/** Returns an amount as entered (value in its own unit) as display text, e.g. "4 drops". */
export function formatEnteredAmount(value: number, unit: AmountUnit): string {
  // Validates the unit key so a typo shows up here rather than as a bare symbol.
  amountDimension(unit);
  return formatQuantity(value, unit);
}
