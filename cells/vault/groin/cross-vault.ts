/**
 * A cross vault of any bay by slicing: each web cut into arches across its generators, each arch
 * analysed by the arch kernel, their reactions gathered down the groins to the corners.
 */
import { notAvailable, type NotAvailable } from '../../not-available.js';
import { archLimit } from '../arch/arch-limit.js';
import { thrustLine } from '../arch/thrust-line.js';
import type { ArchLoads } from '../arch/types.js';
import { crossWebs, webPhiAt, webZ, webZAtPlan, type WebArc } from './cross-webs.js';
import { sliceRing } from './slice-ring.js';
import { groinVault } from './groin-vault.js';

export interface CrossVaultOptions {
  span_x: number; span_y?: number;
  shape?: string;
  /** Rise of the wider web's intrados arc (m): segmental (required), pointed (default equilateral). */
  rise?: number;
  /** Stilt under both webs (m), shape "stilted". */
  stilt?: number;
  thickness: number; unit_weight: number;
  fill_level?: number; fill_unit_weight?: number; dead?: number; live?: number;
  /** Height above the springing to which the pockets are built solid (m); default the least that is needed. */
  solid_level?: number;
  /** Slices per web (default 10). */
  slices?: number;
}

export interface CrossSlice {
  /** Web ("x" spans x) and distance of the slice's mid-plane from the bay's centre line (m). */
  web: string; v: number;
  /** Where the slice springs: φ, the plan distance from the crown axis and the height (m). */
  phi: number; u: number; z: number;
  /** Load of the slice (N) and its thrust range (N); 0 for a sliver at the crown, NaN when the slice holds no line. */
  W: number; H_min: number; H_max: number;
  /** Where the least- and greatest-thrust lines cross the springing joint: plan distance from the crown axis and height (m). */
  x_min: number; z_min: number; x_max: number; z_max: number;
}

export interface CrossVault {
  shape: string;
  /** Clear spans (m), rises of the intrados arcs (m) and stilts (m) of the webs spanning x and y. */
  span_x: number; span_y: number; rise_x: number; rise_y: number; stilt_x: number; stilt_y: number;
  /** Height of the middle surface at the crown above the springing (m). */
  crown: number;
  slices: number;
  /** Least height of solid pocket for which every slice holds a line of thrust (m), and the height used. */
  fill_needed: number; solid_level: number;
  safe: boolean;
  /** Load the slices carry down the groins (N), and its quarter at each corner (N); not available when a slice holds no line. */
  W: number | NotAvailable; V_corner: number | NotAvailable;
  /** Range of the corner thrust in x and in y (N per corner). */
  H_x_min: number | NotAvailable; H_x_max: number | NotAvailable; H_y_min: number | NotAvailable; H_y_max: number | NotAvailable;
  /** Height above the springing at which the corner's horizontal thrust acts, ΣH_k·z_k/ΣH_k: least- and greatest-thrust states (m). */
  z_x_min: number | NotAvailable; z_x_max: number | NotAvailable; z_y_min: number | NotAvailable; z_y_max: number | NotAvailable;
  /** How far inside the corner's vertical plane the corner's vertical reaction acts, ΣV_k·(e − x_k)/ΣV_k (m). */
  a_x_min: number | NotAvailable; a_x_max: number | NotAvailable; a_y_min: number | NotAvailable; a_y_max: number | NotAvailable;
  /** Membrane solution beside it (semicircular webs without a solid pocket): corner thrusts (N) and their heights (m). */
  H_x_membrane: number | NotAvailable; H_y_membrane: number | NotAvailable; z_x_membrane: number | NotAvailable; z_y_membrane: number | NotAvailable;
  readonly model: { x: WebArc; y: WebArc; slices: CrossSlice[] };
}

function checkOptions(o: CrossVaultOptions) {
  const pos = (name: string, v: number | undefined, unit: string) => {
    if (v !== undefined && !(Number.isFinite(v) && v > 0)) throw new RangeError(`cross_vault: ${name} must be positive, got ${v} ${unit}`);
    return v;
  };
  const nn = (name: string, v: number | undefined, unit: string) => {
    if (v !== undefined && !(Number.isFinite(v) && v >= 0)) throw new RangeError(`cross_vault: ${name} must be zero or more, got ${v} ${unit}`);
    return v ?? 0;
  };
  const spanX = pos('span_x', o.span_x, 'm');
  if (spanX === undefined) throw new RangeError('cross_vault: span_x is required');
  const spanY = pos('span_y', o.span_y, 'm') ?? spanX;
  const t = pos('thickness', o.thickness, 'm'), gamma = pos('unit_weight', o.unit_weight, 'N/m^3');
  if (t === undefined || gamma === undefined) throw new RangeError('cross_vault: thickness and unit_weight are required (the slices are masonry rings)');
  if (t >= Math.min(spanX, spanY) / 4) throw new RangeError(`cross_vault: thickness must be less than a quarter of the smaller span, got ${t} m`);
  const shape = o.shape ?? 'semicircular';
  const stilt = nn('stilt', o.stilt, 'm');
  if (shape === 'stilted' && !(stilt > 0)) throw new RangeError('cross_vault: a stilted vault needs stilt, the height of the stilt (m)');
  if (shape !== 'stilted' && stilt > 0) throw new RangeError('cross_vault: stilt belongs to shape "stilted"');
  const rise = pos('rise', o.rise, 'm');
  const Aw = Math.max(spanX, spanY) / 2;
  if (shape === 'segmental' && !(rise !== undefined && rise < Aw)) throw new RangeError(`cross_vault: a segmental vault needs a rise less than half the wider span (${Aw} m), got ${rise} m`);
  if (shape === 'pointed' && rise !== undefined && rise < Aw) throw new RangeError(`cross_vault: a pointed web rises at least half its span (${Aw} m), got ${rise} m`);
  if ((shape === 'semicircular' || shape === 'stilted') && rise !== undefined) throw new RangeError(`cross_vault: rise belongs to a segmental or pointed vault; a ${shape} web rises half its span`);
  const fillLevel = nn('fill_level', o.fill_level, 'm'), fillWeight = nn('fill_unit_weight', o.fill_unit_weight, 'N/m^3');
  if ((fillLevel > 0) !== (fillWeight > 0)) throw new RangeError('cross_vault: fill needs both fill_level and fill_unit_weight');
  const plan = nn('dead', o.dead, 'Pa') + nn('live', o.live, 'Pa');
  const slices = o.slices ?? 10;
  if (!(Number.isInteger(slices) && slices >= 2 && slices <= 60)) throw new RangeError(`cross_vault: slices must be a whole number from 2 to 60, got ${slices}`);
  const solid = o.solid_level === undefined ? undefined : nn('solid_level', o.solid_level, 'm');
  return { spanX, spanY, t, gamma, shape, stilt, rise, fillLevel, fillWeight, plan, slices, solid };
}

/** Loads on a slice whose frame origin lies z0 above the bay's springing. */
function sliceLoads(z0: number, plan: number, fillLevel: number, fillWeight: number): ArchLoads {
  const loads: ArchLoads = {};
  if (plan > 0) loads.dead = plan;
  if (fillWeight > 0 && fillLevel > z0) { loads.fill_unit_weight = fillWeight; loads.fill_level = fillLevel - z0; }
  return loads;
}

/**
 * Cross vault by slicing (the method of slices of Heyman, The Stone Skeleton, Cambridge 1995, ch. on
 * vaults; Ungewitter & Mohrmann, Lehrbuch der gotischen Konstruktionen, 1890, from memory). Each
 * web is cut by vertical planes across its generators into `slices` arches; a slice springs where
 * its web meets the other at the groin, or on the solid pocket when that is higher. Each slice is a
 * ring of the arch kernel (archLimit: least and greatest thrust under its own weight, fill and plan
 * load; thrustLine: where the line crosses its springing). The half vault cut through the crowns of
 * one barrel's slices stands on two corners, so each corner's thrust is the sum of the slice
 * thrusts of one web. Each slice hands the groin its thrust H_k at the height z_k where its line
 * crosses the springing joint, and its load V_k at plan distance e − x_k inside the corner's
 * vertical plane; the corner's resultant is reported by the horizontal thrust's height
 *   z = ΣH_k·z_k / ΣH_k   (a weighted mean of springing heights: within the vault, below the crown)
 * and the vertical reaction's arm a = ΣV_k·(e − x_k) / ΣV_k (every slice reaction on the quarter's
 * groin). The resultant's line crosses the corner's vertical plane at z − a·V/H (moments about the
 * corner), which in the least-thrust state of most bays lies below the springing: the groin and
 * the support under it must carry it there (no thrust between the groins at the boss is assumed).
 * fill_needed: the solid pocket height at which the deepest slice (by the face arch) first holds a
 * line of thrust, by bisection on its springing angle; 0 when it holds springing from the groin.
 * Shallower slices are taken to be no worse (every slice is then analysed; `safe` says whether all hold).
 * @param o spans, shape, rise or stilt, thickness, unit_weight, fill, dead, live, solid_level, slices (SI)
 * @returns corner thrust range and heights, vertical reaction, pocket fill needed, the membrane values beside
 * @example crossVault({span_x: 6, span_y: 4.2, shape: 'pointed', thickness: 0.2, unit_weight: 2e4}).H_x_min
 */
export function crossVault(o: CrossVaultOptions): CrossVault {
  const c = checkOptions(o);
  const webs = crossWebs(c.spanX, c.spanY, c.shape, c.t, c.rise, c.stilt);
  if (c.solid !== undefined) {
    // Above the level where a slice springing on the pocket is two thicknesses wide, every slice of that web is a
    // sliver that carries no thrust: there would be no corner thrust to place.
    const top = (w: WebArc) => w.zc + w.r * Math.cos(Math.asin((2 * c.t + w.c) / (w.r - w.h)));
    const limit = Math.min(top(webs.x), top(webs.y));
    if (c.solid >= limit) {
      throw new RangeError(`cross_vault: solid_level must be below ${limit.toFixed(2)} m, where a slice springing on the pocket is still two thicknesses wide (above it every slice is a sliver that carries no thrust), got ${c.solid} m`);
    }
  }
  const loadsAt = (z0: number) => sliceLoads(z0, c.plan, c.fillLevel, c.fillWeight);
  // The least solid pocket: the deepest slice of each web (by the face arch), cut at the groin or higher,
  // holds a line of thrust for cuts at φ ≤ φ*.
  const holds = (w: WebArc, phi: number) => {
    const { ring, z0 } = sliceRing(w, phi, 1, c.gamma);
    return archLimit(ring, loadsAt(z0)).safe;
  };
  const needed = (w: WebArc, other: WebArc): number => {
    const zg = webZAtPlan(other, other.e * (1 - 0.5 / c.slices));
    const deepest = webPhiAt(w, zg);
    // A deepest slice narrower than two thicknesses is a sliver: nothing to hold.
    if ((w.r - w.h) * Math.sin(deepest) - w.c < 2 * c.t || holds(w, deepest)) return 0;
    // The shallowest cut analysed: a slice two thicknesses wide (narrower ones are slivers).
    let lo = Math.asin(Math.min(1, (2 * c.t + w.c) / (w.r - w.h))), hi = deepest;
    if (!(lo < hi) || !holds(w, lo)) return w.crown;
    for (let i = 0; i < 18; i++) { const mid = (lo + hi) / 2; if (holds(w, mid)) lo = mid; else hi = mid; }
    return webZ(w, lo);
  };
  const fill_needed = Math.max(needed(webs.x, webs.y), needed(webs.y, webs.x));
  const solid = c.solid ?? fill_needed;
  // Slices of each web, one side of the centre line; the other side and the other web of the same barrel are mirror images.
  const slices: CrossSlice[] = [];
  let safe = true, maxBounded = true;
  for (const name of ['x', 'y'] as const) {
    const own = webs[name], other = webs[name === 'x' ? 'y' : 'x'];
    const dv = other.e / c.slices;
    for (let k = 0; k < c.slices; k++) {
      const v = (k + 0.5) * dv;
      const zg = Math.max(webZAtPlan(other, v), solid);
      const phi = webPhiAt(own, zg);
      const uSpring = (own.r - own.h) * Math.sin(phi) - own.c;
      const base = { web: name, v, phi, u: uSpring, z: zg, x_min: uSpring, z_min: zg, x_max: uSpring, z_max: zg };
      if (uSpring < 2 * c.t) {
        // A sliver at the crown, narrower than two thicknesses: its weight goes straight down the groin.
        slices.push({ ...base, W: 2 * c.gamma * c.t * own.r * Math.max(0, phi - own.phiC) * dv, H_min: 0, H_max: 0 });
        continue;
      }
      const { ring, z0 } = sliceRing(own, phi, dv, c.gamma);
      const loads = loadsAt(z0);
      const lim = archLimit(ring, loads);
      // typeof guards: a field the arch kernel cannot give may come as undefined or as "not available".
      const W = typeof lim.V_left === 'number' && typeof lim.V_right === 'number' ? lim.V_left + lim.V_right : NaN;
      if (!lim.safe || typeof lim.H_min !== 'number') {
        safe = false;
        slices.push({ ...base, W, H_min: NaN, H_max: NaN });
        continue;
      }
      const Hmax = typeof lim.H_max === 'number' ? lim.H_max : Infinity;
      // Where each extreme line crosses the springing joint: the last point of thrustLine, in the bay's frame.
      // Nudged inside the range, and further if rounding leaves no line at the very edge.
      const cross = (H: number, dir: number) => {
        for (const eps of [1e-9, 1e-7, 1e-5, 1e-3]) {
          try {
            const pts = thrustLine(ring, loads, H * (1 + dir * eps));
            const p = pts[pts.length - 1]!;
            return { x: p.x, z: p.y + z0 };
          } catch { /* try a little further inside */ }
        }
        throw new RangeError(`cross_vault: no line of thrust could be traced for the slice at ${v.toFixed(3)} m from the centre line`);
      };
      const lo = cross(lim.H_min, 1);
      const hi = Number.isFinite(Hmax) ? cross(Hmax, -1) : lo;
      if (!Number.isFinite(Hmax)) maxBounded = false;
      slices.push({ ...base, W, H_min: lim.H_min, H_max: Hmax, x_min: lo.x, z_min: lo.z, x_max: hi.x, z_max: hi.z });
    }
  }
  // The slices of one web of each barrel; each barrel has two webs (mirror images).
  const W = 2 * slices.reduce((sum, sl) => sum + sl.W, 0);
  const why = 'a slice holds no line of thrust: build the pockets solid higher (see fill_needed) or thicken the webs';
  // The quarter's slice reactions on its groin: the own web's slices push with H at height z_k and load W/2 at
  // plan x_k; the crossing web's slices load W/2 at their plane v. Height of the horizontal thrust's resultant:
  const height = (dir: 'x' | 'y', which: 'min' | 'max'): number | NotAvailable => {
    let H = 0, M = 0;
    for (const sl of slices) {
      if (sl.web !== dir) continue;
      const h = which === 'min' ? sl.H_min : sl.H_max;
      H += h; M += h * (which === 'min' ? sl.z_min : sl.z_max);
    }
    // No horizontal thrust at all (every slice of the web a sliver on its pocket): no height to give.
    return H > 0 ? M / H : notAvailable(`the ${dir}-web's slices deliver no horizontal thrust to the corner, so its thrust has no height`);
  };
  // Arm of the vertical reaction's resultant inside the corner's vertical plane:
  const arm = (dir: 'x' | 'y', which: 'min' | 'max'): number => {
    const e = webs[dir].e;
    let V = 0, M = 0;
    for (const sl of slices) {
      const x = sl.web !== dir ? sl.v : which === 'min' ? sl.x_min : sl.x_max;
      V += sl.W / 2; M += (sl.W / 2) * (e - x);
    }
    return M / V;
  };
  const sum = (dir: 'x' | 'y', which: 'min' | 'max') => slices.reduce((t, sl) => t + (sl.web === dir ? (which === 'min' ? sl.H_min : sl.H_max) : 0), 0);
  const ok = <T>(f: () => T): T | NotAvailable => (safe ? f() : notAvailable(why));
  const unbounded = 'a slice\'s thrust is unbounded (a straight line of thrust fits within it)';
  const membrane = (() => {
    if ((c.shape !== 'semicircular') || solid > 0) {
      const r = notAvailable('the membrane solution is kept beside the slices for semicircular webs without a solid pocket');
      return { Hx: r, Hy: r, zx: r, zy: r };
    }
    const g = groinVault({ span_x: c.spanX, span_y: c.spanY, shape: 'semicircular', thickness: c.t, unit_weight: c.gamma, fill_level: c.fillLevel || undefined, fill_unit_weight: c.fillWeight || undefined, dead: o.dead, live: o.live });
    return { Hx: g.H_corner_x, Hy: g.H_corner_y, zx: g.z_thrust, zy: g.z_thrust_y };
  })();
  const result = {
    shape: c.shape, span_x: c.spanX, span_y: c.spanY,
    rise_x: webs.x.rise, rise_y: webs.y.rise, stilt_x: webs.x.stilt, stilt_y: webs.y.stilt,
    crown: webs.x.crown, slices: c.slices, fill_needed, solid_level: solid, safe,
    W: ok(() => W), V_corner: ok(() => W / 4),
    H_x_min: ok(() => sum('x', 'min')), H_x_max: ok(() => (maxBounded ? sum('x', 'max') : Infinity)),
    H_y_min: ok(() => sum('y', 'min')), H_y_max: ok(() => (maxBounded ? sum('y', 'max') : Infinity)),
    z_x_min: ok(() => height('x', 'min')), z_y_min: ok(() => height('y', 'min')),
    z_x_max: safe && maxBounded ? height('x', 'max') : notAvailable(safe ? unbounded : why),
    z_y_max: safe && maxBounded ? height('y', 'max') : notAvailable(safe ? unbounded : why),
    a_x_min: ok(() => arm('x', 'min')), a_y_min: ok(() => arm('y', 'min')),
    a_x_max: safe && maxBounded ? arm('x', 'max') : notAvailable(safe ? unbounded : why),
    a_y_max: safe && maxBounded ? arm('y', 'max') : notAvailable(safe ? unbounded : why),
    H_x_membrane: membrane.Hx, H_y_membrane: membrane.Hy, z_x_membrane: membrane.zx, z_y_membrane: membrane.zy,
  };
  return Object.defineProperty(result, 'model', { value: { x: webs.x, y: webs.y, slices }, enumerable: false }) as CrossVault;
}
