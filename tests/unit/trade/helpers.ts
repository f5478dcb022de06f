import { readFileSync } from 'node:fs';
import { expect } from 'vitest';

/** Relative difference |a − b| / |b| (absolute when b is 0). */
export function relativeError(actual: number, expected: number): number {
  return expected === 0 ? Math.abs(actual) : Math.abs(actual - expected) / Math.abs(expected);
}

/** Asserts that `actual` matches `expected` to a relative tolerance. */
export function expectRelClose(actual: number, expected: number, tolerance: number): void {
  expect(Number.isFinite(actual), `${actual} is not finite`).toBe(true);
  expect(
    relativeError(actual, expected),
    `${actual} vs ${expected} (relative tolerance ${tolerance})`,
  ).toBeLessThanOrEqual(tolerance);
}

/** Reads a CSV fixture from tests/fixtures into columns of numbers keyed by header. */
export function readCsvColumns(name: string): Record<string, number[]> {
  const text = readFileSync(new URL(`../../fixtures/${name}`, import.meta.url), 'utf8');
  const [header, ...rows] = text.trim().split(/\r?\n/);
  const names = header.split(',').map((h) => h.trim());
  const columns: Record<string, number[]> = Object.fromEntries(names.map((n) => [n, []]));
  for (const row of rows) {
    const cells = row.split(',');
    names.forEach((n, i) => columns[n].push(Number(cells[i])));
  }
  return columns;
}
