// Units of measure. Values are stored and computed in SI (litre, kilogram, degree Celsius,
// millimetre, newton, kilopascal) and converted only at the edges.
//
// Factors are the exact values of NIST SP 811, "Guide for the Use of the International
// System of Units" (2008), Appendix B. Kitchen measures are the US customary ones, not the
// rounded nutrition-label measures of 21 CFR 101.9(b)(5)(viii) (1 tsp = 5 mL and so on).

export const VOLUME_UNITS = ['L', 'mL', 'gal', 'qt', 'cup', 'tbsp', 'tsp'] as const;
export type VolumeUnit = (typeof VOLUME_UNITS)[number];

export const MASS_UNITS = ['kg', 'g', 'lb', 'oz'] as const;
export type MassUnit = (typeof MASS_UNITS)[number];

export const TEMPERATURE_UNITS = ['C', 'F'] as const;
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];

export const LENGTH_UNITS = ['mm', 'cm', 'in'] as const;
export type LengthUnit = (typeof LENGTH_UNITS)[number];

export const FORCE_UNITS = ['N', 'kgf', 'lbf'] as const;
export type ForceUnit = (typeof FORCE_UNITS)[number];

export const PRESSURE_UNITS = ['kPa', 'psi'] as const;
export type PressureUnit = (typeof PRESSURE_UNITS)[number];

/** Counted units: a drop is not a volume until someone states how big a drop is. */
export const COUNT_UNITS = ['drop'] as const;
export type CountUnit = (typeof COUNT_UNITS)[number];

/** Units an ingredient amount may be entered in: volume, mass or a count of drops. */
export const AMOUNT_UNITS = [...VOLUME_UNITS, ...MASS_UNITS, ...COUNT_UNITS] as const;
export type AmountUnit = (typeof AMOUNT_UNITS)[number];

export const UNIT_SYSTEMS = ['metric', 'us'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

/** Litres in one of each volume unit (exact, NIST SP 811 Appendix B). */
export const LITRES_PER: Readonly<Record<VolumeUnit, number>> = {
  L: 1,
  mL: 0.001,
  gal: 3.785411784,
  qt: 0.946352946,
  cup: 0.2365882365,
  tbsp: 0.01478676478125,
  tsp: 0.00492892159375,
};

/** Kilograms in one of each mass unit (exact, NIST SP 811 Appendix B). */
export const KILOGRAMS_PER: Readonly<Record<MassUnit, number>> = {
  kg: 1,
  g: 0.001,
  lb: 0.45359237,
  oz: 0.028349523125,
};

/** Millimetres in one of each length unit (exact, NIST SP 811 Appendix B). */
export const MILLIMETRES_PER: Readonly<Record<LengthUnit, number>> = {
  mm: 1,
  cm: 10,
  in: 25.4,
};

/** Newtons in one of each force unit (NIST SP 811 App. B; exact: lbf = 1 lb × 9.80665 m/s²). */
export const NEWTONS_PER: Readonly<Record<ForceUnit, number>> = {
  N: 1,
  kgf: 9.80665,
  lbf: 4.4482216152605,
};

/** Kilopascals in one of each pressure unit (NIST SP 811 Appendix B: 1 psi = 6894.757293168 Pa). */
export const KILOPASCALS_PER: Readonly<Record<PressureUnit, number>> = {
  kPa: 1,
  psi: 6.894757293168,
};

/**
 * Millilitres in one drop when nothing else is stated: 0.05 mL (20 drops per mL), common
 * practice, no published source. Droppers differ; callers pass their own figure when known.
 */
export const DEFAULT_ML_PER_DROP = 0.05;

function assertFinite(value: number, what: string): void {
  if (!Number.isFinite(value)) throw new RangeError(`${what} must be a finite number`);
}

function assertKnown<U extends string>(table: Readonly<Record<U, number>>, unit: U): number {
  const factor = table[unit];
  if (factor === undefined) throw new RangeError(`Unknown unit: ${String(unit)}`);
  return factor;
}

/** Returns the volume in litres (L); NIST SP 811 Appendix B. */
export function toLitres(value: number, unit: VolumeUnit): number {
  assertFinite(value, 'Volume');
  return value * assertKnown(LITRES_PER, unit);
}

/** Returns a volume given in litres in the requested unit; NIST SP 811 Appendix B. */
export function fromLitres(litres: number, unit: VolumeUnit): number {
  assertFinite(litres, 'Volume');
  return litres / assertKnown(LITRES_PER, unit);
}

/** Returns the mass in kilograms (kg); NIST SP 811 Appendix B. */
export function toKilograms(value: number, unit: MassUnit): number {
  assertFinite(value, 'Mass');
  return value * assertKnown(KILOGRAMS_PER, unit);
}

/** Returns a mass given in kilograms in the requested unit; NIST SP 811 Appendix B. */
export function fromKilograms(kg: number, unit: MassUnit): number {
  assertFinite(kg, 'Mass');
  return kg / assertKnown(KILOGRAMS_PER, unit);
}

/** Returns the length in millimetres (mm); NIST SP 811 Appendix B. */
export function toMillimetres(value: number, unit: LengthUnit): number {
  assertFinite(value, 'Length');
  return value * assertKnown(MILLIMETRES_PER, unit);
}

/** Returns a length given in millimetres in the requested unit; NIST SP 811 Appendix B. */
export function fromMillimetres(mm: number, unit: LengthUnit): number {
  assertFinite(mm, 'Length');
  return mm / assertKnown(MILLIMETRES_PER, unit);
}

/** Returns the force (a press load) in newtons (N); NIST SP 811 Appendix B. */
export function toNewtons(value: number, unit: ForceUnit): number {
  assertFinite(value, 'Force');
  return value * assertKnown(NEWTONS_PER, unit);
}

/** Returns a force given in newtons in the requested unit; NIST SP 811 Appendix B. */
export function fromNewtons(newtons: number, unit: ForceUnit): number {
  assertFinite(newtons, 'Force');
  return newtons / assertKnown(NEWTONS_PER, unit);
}

/** Returns the pressure in kilopascals (kPa); NIST SP 811 Appendix B. */
export function toKilopascals(value: number, unit: PressureUnit): number {
  assertFinite(value, 'Pressure');
  return value * assertKnown(KILOPASCALS_PER, unit);
}

/** Returns a pressure given in kilopascals in the requested unit; NIST SP 811 Appendix B. */
export function fromKilopascals(kPa: number, unit: PressureUnit): number {
  assertFinite(kPa, 'Pressure');
  return kPa / assertKnown(KILOPASCALS_PER, unit);
}

/** Returns a temperature in degrees Celsius (°C) from °C or °F; NIST SP 811 Appendix B. */
export function toCelsius(value: number, unit: TemperatureUnit): number {
  assertFinite(value, 'Temperature');
  if (unit === 'C') return value;
  if (unit === 'F') return (value - 32) / 1.8;
  throw new RangeError(`Unknown unit: ${String(unit)}`);
}

/** Returns a temperature given in °C in the requested unit (°C or °F); NIST SP 811 Appendix B. */
export function fromCelsius(celsius: number, unit: TemperatureUnit): number {
  assertFinite(celsius, 'Temperature');
  if (unit === 'C') return celsius;
  if (unit === 'F') return celsius * 1.8 + 32;
  throw new RangeError(`Unknown unit: ${String(unit)}`);
}

/** Returns a temperature difference in kelvins, i.e. °C (no offset: 1 °F = 5/9 K); NIST SP 811. */
export function deltaToCelsius(delta: number, unit: TemperatureUnit): number {
  assertFinite(delta, 'Temperature difference');
  if (unit === 'C') return delta;
  if (unit === 'F') return delta / 1.8;
  throw new RangeError(`Unknown unit: ${String(unit)}`);
}

/** Returns a temperature difference given in °C in the requested unit (no offset); NIST SP 811. */
export function deltaFromCelsius(deltaC: number, unit: TemperatureUnit): number {
  assertFinite(deltaC, 'Temperature difference');
  if (unit === 'C') return deltaC;
  if (unit === 'F') return deltaC * 1.8;
  throw new RangeError(`Unknown unit: ${String(unit)}`);
}

/** Returns the volume of some drops in litres at a stated mL per drop (common practice). */
export function dropsToLitres(drops: number, mlPerDrop: number = DEFAULT_ML_PER_DROP): number {
  assertFinite(drops, 'Drop count');
  if (!(mlPerDrop > 0) || !Number.isFinite(mlPerDrop)) {
    throw new RangeError('Millilitres per drop must be a positive number');
  }
  return (drops * mlPerDrop) / 1000;
}

/** Returns the drops in a volume given in litres at a stated mL per drop (common practice). */
export function litresToDrops(litres: number, mlPerDrop: number = DEFAULT_ML_PER_DROP): number {
  assertFinite(litres, 'Volume');
  if (!(mlPerDrop > 0) || !Number.isFinite(mlPerDrop)) {
    throw new RangeError('Millilitres per drop must be a positive number');
  }
  return (litres * 1000) / mlPerDrop;
}

/** Returns a volume converted between any two volume units (same unit family); NIST SP 811. */
export function convertVolume(value: number, from: VolumeUnit, to: VolumeUnit): number {
  return from === to ? value : fromLitres(toLitres(value, from), to);
}

/** Returns a mass converted between any two mass units; NIST SP 811 Appendix B. */
export function convertMass(value: number, from: MassUnit, to: MassUnit): number {
  return from === to ? value : fromKilograms(toKilograms(value, from), to);
}

/** Returns a temperature converted between °C and °F; NIST SP 811 Appendix B. */
export function convertTemperature(
  value: number,
  from: TemperatureUnit,
  to: TemperatureUnit,
): number {
  return from === to ? value : fromCelsius(toCelsius(value, from), to);
}

/** Which physical quantity an amount measures. */
export type AmountDimension = 'volume' | 'mass' | 'count';

/** An amount in its SI unit: litres for volume, kilograms for mass, drops for counts. */
export interface SiAmount {
  dimension: AmountDimension;
  /** L for volume, kg for mass, drops for count. */
  value: number;
}

/** Returns the dimension an amount unit measures (volume, mass or count). */
export function amountDimension(unit: AmountUnit): AmountDimension {
  if ((VOLUME_UNITS as readonly string[]).includes(unit)) return 'volume';
  if ((MASS_UNITS as readonly string[]).includes(unit)) return 'mass';
  if ((COUNT_UNITS as readonly string[]).includes(unit)) return 'count';
  throw new RangeError(`Unknown unit: ${String(unit)}`);
}

// Drops are kept as a count here, never turned into a volume.
/** Returns an amount in its SI unit with its dimension: L, kg or drops (NIST SP 811 App. B). */
export function amountToSi(value: number, unit: AmountUnit): SiAmount {
  const dimension = amountDimension(unit);
  if (dimension === 'volume') return { dimension, value: toLitres(value, unit as VolumeUnit) };
  if (dimension === 'mass') return { dimension, value: toKilograms(value, unit as MassUnit) };
  assertFinite(value, 'Drop count');
  return { dimension, value };
}

/** Returns an SI amount in the requested unit of the same dimension; NIST SP 811 Appendix B. */
export function amountFromSi(amount: SiAmount, unit: AmountUnit): number {
  const dimension = amountDimension(unit);
  if (dimension !== amount.dimension) {
    throw new RangeError(`Cannot express a ${amount.dimension} in ${unit}`);
  }
  if (dimension === 'volume') return fromLitres(amount.value, unit as VolumeUnit);
  if (dimension === 'mass') return fromKilograms(amount.value, unit as MassUnit);
  return amount.value;
}

// Drops become a volume only with an explicit mL-per-drop figure; a mass throws.
/** Returns the amount as a volume in L; drops at a stated mL per drop (common practice). */
export function amountToLitres(value: number, unit: AmountUnit, mlPerDrop?: number): number {
  const dimension = amountDimension(unit);
  if (dimension === 'volume') return toLitres(value, unit as VolumeUnit);
  if (dimension === 'count') {
    if (mlPerDrop === undefined) {
      throw new RangeError('Drops need a stated mL per drop to become a volume');
    }
    return dropsToLitres(value, mlPerDrop);
  }
  throw new RangeError(`A mass in ${unit} has no volume without a density`);
}

/** Default units a member of each system enters and reads values in (common practice). */
export const PREFERRED_UNITS: Readonly<
  Record<
    UnitSystem,
    {
      milk: VolumeUnit;
      cheese: MassUnit;
      temperature: TemperatureUnit;
      mould: LengthUnit;
      load: ForceUnit;
      pressure: PressureUnit;
    }
  >
> = {
  metric: { milk: 'L', cheese: 'kg', temperature: 'C', mould: 'cm', load: 'kgf', pressure: 'kPa' },
  us: { milk: 'gal', cheese: 'lb', temperature: 'F', mould: 'in', load: 'lbf', pressure: 'psi' },
};
