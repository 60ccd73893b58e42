/**
 * A steel tie across the springings, taking the vault's thrust in tension.
 */

/** Nominal diameters of the round bars offered (mm): the preferred reinforcing-bar series of EN 10080 (from memory), common practice for tie rods. */
export const BAR_DIAMETERS_MM = [8, 10, 12, 16, 20, 25, 32, 40, 50] as const;

export interface Tie {
  /** Tension in the tie (N): the thrust it replaces. */
  force: number;
  /** Required net area (m²) = force·γ_M / f_y. */
  area: number;
  /** Smallest bar of the series that suffices: diameter (m) and area (m²). */
  bar_diameter: number; bar_area: number;
  /** area / bar_area. */
  utilization: number;
}

/**
 * Tie sized by yield of the gross section, A = T·γ_M/f_y (EN 1993-1-1
 * §6.2.3, N_pl,Rd = A·f_y/γ_M0 with γ_M0 = 1.00 recommended; from memory).
 * A threaded end has a smaller net area and its own check (γ_M2 on f_u),
 * which this does not make.
 * @param o T the thrust (N), f_y the yield strength (Pa), gamma_M the partial factor (default 1.0)
 * @returns force, required area and the smallest bar of the series
 * @example tie({T: 100e3, f_y: 235e6}).bar_diameter // 0.025 (491 mm² ≥ 426 mm²)
 */
export function tie(o: { T: number; f_y: number; gamma_M?: number }): Tie {
  if (!(o.T > 0)) throw new RangeError(`tie: T must be positive, got ${o.T} N`);
  if (!(o.f_y > 0)) throw new RangeError(`tie: f_y must be positive, got ${o.f_y} Pa`);
  const gammaM = o.gamma_M ?? 1.0;
  if (!(gammaM >= 1 && gammaM <= 3)) throw new RangeError(`tie: gamma_M must be between 1 and 3, got ${gammaM}`);
  const area = (o.T * gammaM) / o.f_y;
  const d = BAR_DIAMETERS_MM.find((mm) => (Math.PI * (mm / 1e3) ** 2) / 4 >= area);
  if (d === undefined) {
    const most = BAR_DIAMETERS_MM[BAR_DIAMETERS_MM.length - 1]!;
    throw new RangeError(`tie: needs ${(area * 1e6).toFixed(0)} mm², more than one ${most} mm bar (${((Math.PI * most * most) / 4).toFixed(0)} mm²); use several ties`);
  }
  const bar_diameter = d / 1e3, bar_area = (Math.PI * bar_diameter ** 2) / 4;
  return { force: o.T, area, bar_diameter, bar_area, utilization: area / bar_area };
}
