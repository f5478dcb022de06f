import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { milkMassKg, milkVolumeLitres } from '../../../shared/trade/milk';
import {
  amountForMilk,
  amountPerLitreOfMilk,
  scaleAmount,
  scaleAmounts,
} from '../../../shared/trade/scaling';
import {
  AMOUNT_UNITS,
  FORCE_UNITS,
  LENGTH_UNITS,
  MASS_UNITS,
  PRESSURE_UNITS,
  TEMPERATURE_UNITS,
  VOLUME_UNITS,
  amountFromSi,
  amountToSi,
  convertMass,
  convertTemperature,
  convertVolume,
  deltaFromCelsius,
  deltaToCelsius,
  dropsToLitres,
  fromCelsius,
  fromKilograms,
  fromKilopascals,
  fromLitres,
  fromMillimetres,
  fromNewtons,
  litresToDrops,
  toCelsius,
  toKilograms,
  toKilopascals,
  toLitres,
  toMillimetres,
  toNewtons,
} from '../../../shared/trade/units';

// Property tests (fast-check): converting there and back returns the value, for every unit.
// Tolerance: a few units in the last place of a double, relative to the value's size.

const value = fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true });
const positive = fc.double({ min: 1e-3, max: 1e5, noNaN: true, noDefaultInfinity: true });

function closeTo(actual: number, expected: number, rel = 1e-12): boolean {
  return Math.abs(actual - expected) <= rel * Math.max(1, Math.abs(expected));
}

describe('round trips of every conversion (fast-check)', () => {
  const families = [
    ['volume', VOLUME_UNITS, toLitres, fromLitres],
    ['mass', MASS_UNITS, toKilograms, fromKilograms],
    ['length', LENGTH_UNITS, toMillimetres, fromMillimetres],
    ['force', FORCE_UNITS, toNewtons, fromNewtons],
    ['pressure', PRESSURE_UNITS, toKilopascals, fromKilopascals],
    ['temperature', TEMPERATURE_UNITS, toCelsius, fromCelsius],
    ['temperature difference', TEMPERATURE_UNITS, deltaToCelsius, deltaFromCelsius],
  ] as const;

  it.each(families)('%s: to SI and back, in every unit', (_name, units, toSi, fromSi) => {
    const to = toSi as (v: number, u: string) => number;
    const from = fromSi as (v: number, u: string) => number;
    fc.assert(
      fc.property(value, fc.constantFrom(...units), (v, unit) => {
        expect(closeTo(from(to(v, unit), unit), v)).toBe(true);
      }),
    );
  });

  it('volume, mass and temperature between any two units and back', () => {
    fc.assert(
      fc.property(
        value,
        fc.constantFrom(...VOLUME_UNITS),
        fc.constantFrom(...VOLUME_UNITS),
        (v, a, b) => {
          expect(closeTo(convertVolume(convertVolume(v, a, b), b, a), v)).toBe(true);
        },
      ),
    );
    fc.assert(
      fc.property(
        value,
        fc.constantFrom(...MASS_UNITS),
        fc.constantFrom(...MASS_UNITS),
        (v, a, b) => {
          expect(closeTo(convertMass(convertMass(v, a, b), b, a), v)).toBe(true);
        },
      ),
    );
    fc.assert(
      fc.property(
        value,
        fc.constantFrom(...TEMPERATURE_UNITS),
        fc.constantFrom(...TEMPERATURE_UNITS),
        (v, a, b) => {
          expect(closeTo(convertTemperature(convertTemperature(v, a, b), b, a), v)).toBe(true);
        },
      ),
    );
  });

  it('ingredient amounts: to their SI amount and back, in every amount unit', () => {
    fc.assert(
      fc.property(value, fc.constantFrom(...AMOUNT_UNITS), (v, unit) => {
        expect(closeTo(amountFromSi(amountToSi(v, unit), unit), v)).toBe(true);
      }),
    );
  });

  it('drops to litres and back at any stated mL per drop', () => {
    const mlPerDrop = fc.double({ min: 0.01, max: 0.2, noNaN: true });
    fc.assert(
      fc.property(value, mlPerDrop, (drops, ml) => {
        expect(closeTo(litresToDrops(dropsToLitres(drops, ml), ml), drops)).toBe(true);
      }),
    );
  });

  it('milk volume to mass and back', () => {
    fc.assert(
      fc.property(positive, (litres) => {
        expect(closeTo(milkVolumeLitres(milkMassKg(litres)), litres)).toBe(true);
      }),
    );
  });
});

describe('scaling there and back (fast-check)', () => {
  it('an amount scaled to another milk volume and back is unchanged', () => {
    fc.assert(
      fc.property(value, positive, positive, (amount, from, to) => {
        expect(closeTo(scaleAmount(scaleAmount(amount, from, to), to, from), amount)).toBe(true);
      }),
    );
  });

  it('every item of a recipe scales there and back, units untouched', () => {
    const item = fc.record({ amount: value, unit: fc.constantFrom(...AMOUNT_UNITS) });
    fc.assert(
      fc.property(fc.array(item, { maxLength: 12 }), positive, positive, (items, from, to) => {
        const back = scaleAmounts(scaleAmounts(items, from, to), to, from);
        back.forEach((b, i) => {
          expect(b.unit).toBe(items[i].unit);
          expect(closeTo(b.amount, items[i].amount)).toBe(true);
        });
      }),
    );
  });

  it('an amount per litre of milk and back gives the amount', () => {
    fc.assert(
      fc.property(value, positive, (amount, litres) => {
        expect(closeTo(amountForMilk(amountPerLitreOfMilk(amount, litres), litres), amount)).toBe(
          true,
        );
      }),
    );
  });
});
