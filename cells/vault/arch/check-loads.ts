import type { ArchLoads, ArchRing } from './types.js';
import { ringPoint } from './ring-point.js';

/**
 * Refuses loads outside the model's domain, naming the option: negative
 * loads, fill without both its unit weight and level, a fill level below the
 * springing, a live-load stretch that is empty, a point load without its
 * position or off the ring.
 * @param fn the calling cell function's name, for messages
 * @param ring the ring
 * @param loads loads as given
 * @returns nothing; throws RangeError
 * @example checkLoads('arch_limit', ring, {dead: -1}) // RangeError: arch_limit: dead must be ≥ 0, got -1 N/m^2
 */
export function checkLoads(fn: string, ring: ArchRing, loads: ArchLoads): void {
  const units: Record<string, string> = { fill_unit_weight: 'N/m^3', dead: 'N/m^2', live: 'N/m^2', P: 'N', spread: '', fill_pressure: '' };
  for (const [key, unit] of Object.entries(units)) {
    const v = loads[key as keyof ArchLoads];
    if (v !== undefined && !(typeof v === 'number' && v >= 0 && Number.isFinite(v))) throw new RangeError(`${fn}: ${key} must be ≥ 0, got ${v} ${unit}`.trimEnd());
  }
  for (const key of ['fill_level', 'live_from', 'live_to', 'P_at'] as const) {
    const v = loads[key];
    if (v !== undefined && !Number.isFinite(v)) throw new RangeError(`${fn}: ${key} must be a finite length, got ${v} m`);
  }
  if (loads.axles !== undefined && !Array.isArray(loads.axles)) throw new RangeError(`${fn}: axles must be a list of {W, at}`);
  (loads.axles ?? []).forEach((a, i) => {
    if (!(typeof a.W === 'number' && a.W >= 0 && Number.isFinite(a.W))) throw new RangeError(`${fn}: axles[${i + 1}].W must be ≥ 0, got ${a.W} N`);
    if (!(typeof a.at === 'number' && Number.isFinite(a.at))) throw new RangeError(`${fn}: axles[${i + 1}].at must be a finite length, got ${a.at} m`);
  });
  if ((loads.fill_unit_weight === undefined) !== (loads.fill_level === undefined)) {
    throw new RangeError(`${fn}: fill needs both fill_unit_weight and fill_level`);
  }
  if (loads.fill_pressure && loads.fill_level === undefined) throw new RangeError(`${fn}: fill_pressure needs fill (fill_unit_weight and fill_level)`);
  if (loads.fill_level !== undefined && loads.fill_level < 0) {
    throw new RangeError(`${fn}: fill_level must be at or above the springing (≥ 0), got ${loads.fill_level} m`);
  }
  if (loads.live_from !== undefined && loads.live_to !== undefined && !(loads.live_from < loads.live_to)) {
    throw new RangeError(`${fn}: live_from must be less than live_to, got ${loads.live_from} m and ${loads.live_to} m`);
  }
  if (loads.P !== undefined && loads.P > 0) {
    if (loads.P_at === undefined) throw new RangeError(`${fn}: P_at is required with P`);
    const c = ring.centreline;
    const reach = ringPoint(c, Math.min(c.phiSpringing, Math.PI / 2), ring.thickness / 2).x;
    const x = loads.P_at - ring.span / 2;
    if (Math.abs(x) > reach) {
      throw new RangeError(`${fn}: P_at must lie over the ring, between ${ring.span / 2 - reach} m and ${ring.span / 2 + reach} m, got ${loads.P_at} m`);
    }
  }
}
