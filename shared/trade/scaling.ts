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

/** Returns the factor amounts are multiplied by to go from one milk volume to another (ratio). */
export function scaleFactor(fromMilkLitres: number, toMilkLitres: number): number {
  assertPositiveLitres(fromMilkLitres, 'Original milk volume');
  assertPositiveLitres(toMilkLitres, 'New milk volume');
  return toMilkLitres / fromMilkLitres;
}

/** Returns an amount scaled to a new milk volume, in the amount's own unit (proportion). */
export function scaleAmount(amount: number, fromMilkLitres: number, toMilkLitres: number): number {
  assertFinite(amount, 'Amount');
  return amount * scaleFactor(fromMilkLitres, toMilkLitres);
}

/** Returns copies of the items with `amount` scaled to the new milk volume, units kept (proportion). */
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

/** Returns an amount per litre of milk, in the amount's unit per L (proportion). */
export function amountPerLitreOfMilk(amount: number, milkLitres: number): number {
  assertFinite(amount, 'Amount');
  assertPositiveLitres(milkLitres, 'Milk volume');
  return amount / milkLitres;
}

/** Returns the amount for a milk volume from a rate per litre, in the rate's unit (proportion). */
export function amountForMilk(ratePerLitre: number, milkLitres: number): number {
  assertFinite(ratePerLitre, 'Rate per litre');
  if (!Number.isFinite(milkLitres) || milkLitres < 0) {
    throw new RangeError('Milk volume must be a non-negative number of litres');
  }
  return ratePerLitre * milkLitres;
}
