import { expect } from 'vitest';

/** Asserts |actual − expected| ≤ relTol·max(|expected|, absFloor). */
export function expectClose(actual: number, expected: number, relTol = 1e-9, absFloor = 1e-12): void {
  expect(Number.isFinite(actual), `expected a finite number, got ${actual}`).toBe(true);
  const tol = relTol * Math.max(Math.abs(expected), absFloor);
  if (Math.abs(actual - expected) > tol) {
    expect.fail(`expected ${actual} to be within ${relTol} (relative) of ${expected}; off by ${Math.abs(actual - expected)}`);
  }
}

/** A kernel field that must be a number here (not "not available"): fails the test otherwise. */
export function numberField(x: unknown): number {
  if (typeof x !== 'number') expect.fail(`expected a number, got ${String(x)}`);
  return x as number;
}

/** A kernel field that must be a list here (not "not available"): fails the test otherwise. */
export function listField<T>(x: T[] | object): T[] {
  if (!Array.isArray(x)) expect.fail(`expected a list, got ${String(x)}`);
  return x as T[];
}
