// Scaling a journal to another milk volume. Every ingredient amount is proportional to the
// milk it goes into; temperatures, times, pH and cut size are not and are left alone.

function assertPositiveLitres(litres: number, what: string): void {
  if (!Number.isFinite(litres) || litres <= 0) {
    throw new RangeError(`${what} must be a positive number of litres`);
  }
}

function assertFinite(value: number, what: string): void {
  if (!Number.isFinite(value)) throw new RangeError(`${what} must be a finite number`);
}

/** Returns the scale factor new ÷ old milk volume (ratio; common practice, no published source). */
export function scaleFactor(fromMilkLitres: number, toMilkLitres: number): number {
  assertPositiveLitres(fromMilkLitres, 'Original milk volume');
  assertPositiveLitres(toMilkLitres, 'New milk volume');
  return toMilkLitres / fromMilkLitres;
}

/** Returns an amount scaled to a new milk volume (common practice, no published source). */
export function scaleAmount(amount: number, fromMilkLitres: number, toMilkLitres: number): number {
  assertFinite(amount, 'Amount');
  return amount * scaleFactor(fromMilkLitres, toMilkLitres);
}

/** Returns the items with `amount` scaled, units kept (common practice, no published source). */
export function scaleAmounts<T extends { amount: number }>(
  items: readonly T[],
  fromMilkLitres: number,
  toMilkLitres: number,
): T[] {
  const factor = scaleFactor(fromMilkLitres, toMilkLitres);
  return items.map((item) => {
    assertFinite(item.amount, 'Amount');
    return { ...item, amount: item.amount * factor };
  });
}

/** Returns an amount per litre of milk, unit per L (common practice, no published source). */
export function amountPerLitreOfMilk(amount: number, milkLitres: number): number {
  assertFinite(amount, 'Amount');
  assertPositiveLitres(milkLitres, 'Milk volume');
  return amount / milkLitres;
}

/** Returns rate per litre × milk litres (common practice, no published source). */
export function amountForMilk(ratePerLitre: number, milkLitres: number): number {
  assertFinite(ratePerLitre, 'Rate per litre');
  if (!Number.isFinite(milkLitres) || milkLitres < 0) {
    throw new RangeError('Milk volume must be a non-negative number of litres');
  }
  return ratePerLitre * milkLitres;
}
