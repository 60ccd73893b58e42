/**
 * A steel tie across the springings, taking the vault's thrust in tension: the bar and its threaded ends.
 */
import { notAvailable, type NotAvailable } from '../not-available.js';
import { METRIC_COARSE, threadOnBar } from './thread.js';

/** The next ISO coarse size after the table's last (M68 × 6, ISO 261; from memory): a bar this thick or more would carry a thread the table does not hold. */
const NEXT_THREAD_MM = 68;

/** Nominal diameters of the round bars offered (mm): the preferred reinforcing-bar series of EN 10080 (from memory), common practice for tie rods. */
export const BAR_DIAMETERS_MM = [8, 10, 12, 16, 20, 25, 32, 40, 50] as const;

/** Resistance factor of a threaded part in tension, EN 1993-1-8 Table 3.4 (k2 = 0.9; 0.63 for countersunk bolts). */
export const K2 = 0.9;

export interface TieOptions {
  /** Thrust the tie takes (N). */
  T: number;
  /** Yield strength (Pa) and partial factor γ_M0 of the bar (default 1.0). */
  f_y: number; gamma_M?: number;
  /** Ultimate strength (Pa) and partial factor γ_M2 (default 1.25) of the threaded ends. */
  f_u?: number; gamma_M2?: number;
  /** The chosen bar (m), 8 mm to under 68 mm; when omitted, the smallest bar of the series that passes both checks. */
  diameter?: number;
}

export interface Tie {
  /** Tension in the tie (N): the thrust it replaces. */
  force: number;
  /** Required gross area T·γ_M0/f_y (m²). */
  area: number;
  /** The bar checked: diameter (m) and gross area (m²). */
  bar_diameter: number; bar_area: number;
  /** Thread on its ends: designation, nominal diameter (m) and tensile stress area (m²). */
  thread: string; thread_diameter: number; thread_area: number;
  /** Design resistances (N): N_pl,Rd = A·f_y/γ_M0 of the bar; F_t,Rd = k2·f_u·A_s/γ_M2 of the thread. */
  N_bar_Rd: number; N_thread_Rd: number | NotAvailable;
  /** T/N_pl,Rd, T/F_t,Rd and the greater of the two. */
  utilization_bar: number; utilization_thread: number | NotAvailable; utilization: number | NotAvailable;
  /** "bar" or "thread": the check with the greater utilization. */
  governs: string | NotAvailable;
  /** Smallest bar of the series whose bar and thread both suffice (m). */
  bar_needed: number | NotAvailable;
}

function barArea(d: number): number {
  return (Math.PI * d * d) / 4;
}

/**
 * Tie checked on its bar and on its threaded ends. Bar: gross-section yield, N_pl,Rd = A·f_y/γ_M0
 * (EN 1993-1-1 §6.2.3 (2)a, γ_M0 = 1.00 recommended; from memory). Threaded ends: tension resistance
 * of a threaded part F_t,Rd = k2·f_ub·A_s/γ_M2 with k2 = 0.9 (EN 1993-1-8 §3.6.1, Table 3.4; γ_M2 =
 * 1.25 recommended, Table 2.1; from memory), A_s the tensile stress area of the metric coarse thread
 * cut on the bar (ISO 898-1, see thread.ts). The utilization is the greater of the two.
 * @param o T, f_y, gamma_M, f_u, gamma_M2 (SI), diameter of the chosen bar (m)
 * @returns both checks, which governs and the bar to choose
 * @example tie({T: 140e3, f_y: 235e6, f_u: 360e6, diameter: 0.032}).utilization_thread // 140e3/(0.9·360e6·561e-6/1.25) ≈ 0.963
 */
export function tie(o: TieOptions): Tie {
  if (!(o.T > 0 && Number.isFinite(o.T))) throw new RangeError(`tie: T must be positive, got ${o.T} N`);
  if (!(o.f_y > 0)) throw new RangeError(`tie: f_y must be positive, got ${o.f_y} Pa`);
  const gammaM = o.gamma_M ?? 1.0, gammaM2 = o.gamma_M2 ?? 1.25;
  if (!(gammaM >= 1 && gammaM <= 3)) throw new RangeError(`tie: gamma_M must be between 1 and 3, got ${gammaM}`);
  if (!(gammaM2 >= 1 && gammaM2 <= 3)) throw new RangeError(`tie: gamma_M2 must be between 1 and 3, got ${gammaM2}`);
  if (o.f_u !== undefined && !(o.f_u >= o.f_y)) throw new RangeError(`tie: f_u must be at least f_y (${o.f_y} Pa), got ${o.f_u} Pa`);
  const area = (o.T * gammaM) / o.f_y;
  const check = (d: number) => {
    const th = threadOnBar(d);
    const uBar = (o.T * gammaM) / (barArea(d) * o.f_y);
    const rThread = th && o.f_u !== undefined ? (K2 * o.f_u * th.A_s) / gammaM2 : undefined;
    return { th, uBar, rThread, uThread: rThread === undefined ? undefined : o.T / rThread };
  };
  const passes = (d: number) => { const c = check(d); return c.uBar <= 1 && (c.uThread === undefined || c.uThread <= 1); };
  const needed = BAR_DIAMETERS_MM.find((mm) => passes(mm / 1e3));
  let d = o.diameter;
  if (d === undefined) {
    if (needed === undefined) {
      const most = BAR_DIAMETERS_MM[BAR_DIAMETERS_MM.length - 1]!;
      throw new RangeError(`tie: T = ${o.T} N is more than one ${most} mm bar (${barArea(most).toFixed(0)} mm², thread ${threadOnBar(most / 1e3)!.name}) can take; use several ties`);
    }
    d = needed / 1e3;
  } else if (!(d >= 0.008 && d < NEXT_THREAD_MM / 1e3)) {
    throw new RangeError(`tie: diameter must be at least 8 mm (thread M8) and less than ${NEXT_THREAD_MM} mm: the table of thread stress areas ends at M${METRIC_COARSE[METRIC_COARSE.length - 1]!.d} and a thicker bar carries a thread it does not hold; got ${d} m`);
  }
  const c = check(d);
  const th = c.th!;
  const noFu = 'f_u is not given, so the threaded ends are not checked; give the steel\'s ultimate strength f_u';
  const uThread = c.uThread ?? notAvailable(noFu);
  return {
    force: o.T, area,
    bar_diameter: d, bar_area: barArea(d),
    thread: th.name, thread_diameter: th.d, thread_area: th.A_s,
    N_bar_Rd: (barArea(d) * o.f_y) / gammaM, N_thread_Rd: c.rThread ?? notAvailable(noFu),
    utilization_bar: c.uBar, utilization_thread: uThread,
    utilization: c.uThread === undefined ? notAvailable(noFu) : Math.max(c.uBar, c.uThread),
    governs: c.uThread === undefined ? notAvailable(noFu) : c.uThread > c.uBar ? 'thread' : 'bar',
    bar_needed: needed === undefined ? notAvailable(`no single bar of the series up to ${BAR_DIAMETERS_MM[BAR_DIAMETERS_MM.length - 1]} mm suffices; use several ties`) : needed / 1e3,
  };
}
