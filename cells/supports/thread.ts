/**
 * The metric coarse screw thread of a tie's ends: its tensile stress area.
 */

/**
 * ISO metric coarse threads, nominal diameter d (mm), pitch P (mm) and tensile stress area A_s (mm²),
 * first and second choice sizes M8…M64: pitches of ISO 261 / ISO 724, stress areas as tabulated in
 * ISO 898-1 (Table of nominal stress areas; values from memory). A_s is defined there by
 * A_s = π/4·((d2 + d3)/2)² with d2 = d − 0.649519·P (pitch diameter, ISO 724) and
 * d3 = d − 1.226869·P (minor diameter of the bolt thread, ISO 898-1); the tests recompute every row.
 */
export const METRIC_COARSE = [
  { d: 8, P: 1.25, A_s: 36.6 }, { d: 10, P: 1.5, A_s: 58.0 }, { d: 12, P: 1.75, A_s: 84.3 },
  { d: 14, P: 2, A_s: 115 }, { d: 16, P: 2, A_s: 157 }, { d: 18, P: 2.5, A_s: 192 },
  { d: 20, P: 2.5, A_s: 245 }, { d: 22, P: 2.5, A_s: 303 }, { d: 24, P: 3, A_s: 353 },
  { d: 27, P: 3, A_s: 459 }, { d: 30, P: 3.5, A_s: 561 }, { d: 33, P: 3.5, A_s: 694 },
  { d: 36, P: 4, A_s: 817 }, { d: 39, P: 4, A_s: 976 }, { d: 42, P: 4.5, A_s: 1120 },
  { d: 45, P: 4.5, A_s: 1300 }, { d: 48, P: 5, A_s: 1470 }, { d: 52, P: 5, A_s: 1760 },
  { d: 56, P: 5.5, A_s: 2030 }, { d: 60, P: 5.5, A_s: 2360 }, { d: 64, P: 6, A_s: 2680 },
] as const;

export interface Thread {
  /** Designation, e.g. "M30". */
  name: string;
  /** Nominal diameter (m), pitch (m) and tensile stress area (m²). */
  d: number; P: number; A_s: number;
}

/**
 * The thread cut on the end of a round bar: the largest metric coarse size whose nominal diameter
 * does not exceed the bar's (a 32 mm bar takes M30; common practice for cut threads — an upset end
 * carries a larger thread and is not modelled).
 * @param diameter bar diameter (m)
 * @returns the thread, or undefined when the bar is thinner than M8
 * @example threadOnBar(0.032).name // 'M30'
 */
export function threadOnBar(diameter: number): Thread | undefined {
  const mm = diameter * 1e3 * (1 + 1e-9);
  let best: (typeof METRIC_COARSE)[number] | undefined;
  for (const row of METRIC_COARSE) if (row.d <= mm) best = row;
  return best && { name: `M${best.d}`, d: best.d / 1e3, P: best.P / 1e3, A_s: best.A_s / 1e6 };
}
