/**
 * A result field that does not exist in the state the kernel found (the thrust range of a ring that
 * holds no line of thrust, the stress under a wall that overturns). Kernels return it in place of
 * the number, with the reason in the user's words; every declared field is therefore always present.
 *
 * An unbounded quantity is not this: it is `Infinity` (a ring that never collapses has
 * load_factor = Infinity), which carries its unit like any other number.
 */
export class NotAvailable {
  readonly isNotAvailable = true as const;
  constructor(readonly reason: string) {
    Object.freeze(this);
  }
  toString(): string {
    return `not available — ${this.reason}`;
  }
}

/** A field that does not exist in this state, with the reason. */
export function notAvailable(reason: string): NotAvailable {
  return new NotAvailable(reason);
}

/** Is this value a field that is not available? */
export function isNotAvailable(value: unknown): value is NotAvailable {
  return value instanceof NotAvailable;
}
