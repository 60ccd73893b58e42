/**
 * The domain checks every profile family repeats: lengths and angles must be
 * positive finite numbers, and the message names the family and the option.
 */

/** Angle in degrees for messages, to six significant digits. */
export function degrees(rad: number): string {
  return `${Number(((rad * 180) / Math.PI).toPrecision(6))}°`;
}

/**
 * Throws a RangeError unless value is a positive finite number.
 * @param family profile or function name that prefixes the message ('catenary')
 * @param name option name as a document writes it ('rise')
 * @param value the value (SI)
 * @param unit unit shown in the message ('m'); 'rad' prints degrees
 * @returns value, for chaining
 * @example requirePositive('catenary', 'rise', -0.2, 'm') // throws "catenary: rise must be positive, got -0.2 m"
 */
export function requirePositive(family: string, name: string, value: number, unit: string): number {
  if (value === undefined) throw new RangeError(`${family}: ${name} is required`);
  if (typeof value !== 'number' || !Number.isFinite(value) || !(value > 0)) {
    const shown = unit === 'rad' && typeof value === 'number' ? degrees(value) : `${value}${unit ? ' ' + unit : ''}`;
    throw new RangeError(`${family}: ${name} must be positive, got ${shown}`);
  }
  return value;
}
