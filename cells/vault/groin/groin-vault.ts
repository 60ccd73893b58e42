/**
 * Statics of one bay of a cross (groin) vault standing on four corners:
 * weights and centroids of the webs, the membrane hoop force at the crown,
 * and the corner reactions with the height at which the thrust acts.
 */
import { groinInput, type GroinInput, type GroinVaultOptions } from './options.js';
import { groinSections, type BarrelSection } from './sections.js';
import { webIntegrals } from './web-integrals.js';
import { webLoad, type WebLoad } from './web-load.js';

/** What web_membrane_at and vault_bays need from a vault (not shown on the sheet). */
export interface GroinModel {
  input: GroinInput;
  x: { section: BarrelSection; load: WebLoad };
  y: { section: BarrelSection; load: WebLoad };
}

export interface GroinVault {
  shape: string;
  /** Height of the middle surface at the crown above the springing (m). */
  crown: number;
  area_web_x: number; area_web_y: number; area: number;
  W: number; W_half: number; x_half: number; N_crown: number; thrust_cut: number; h_thrust: number;
  W_half_y: number; x_half_y: number; N_crown_y: number; thrust_cut_y: number; h_thrust_y: number;
  V_corner: number; H_corner_x: number; H_corner_y: number; H_corner: number; z_thrust: number; z_thrust_y: number;
  /** Pointed webs only: line load (N/m) their membrane state needs along each ridge; 0 when round. */
  ridge_load_x: number; ridge_load_y: number;
  readonly model: GroinModel;
}

/**
 * Cross vault by membrane theory of its webs and statics of the half vault,
 * after Heyman, Equilibrium of Shell Structures (Oxford 1977), cross-vault
 * chapter. Each web is a barrel segment; its hoop force N_φ = p_r·R
 * (radial equilibrium, Flügge ch. 3) gives, at the crown, the force per
 * unit length across a vertical cut through the centre parallel to the
 * y-side (plane x = 0). The half vault x > 0 then stands on two corners:
 *   horizontal  2·H_x = thrust_cut = |N_crown|·cos φ_crown · 2e_y,
 *   moments about the corner line  thrust_cut·h = W_half·(e_x − x_half),
 * so the corner thrust acts h below the crown. The same cut through y = 0
 * gives the y-values. The corner stands at the middle surface's springing,
 * half a thickness outside the clear span.
 * A pointed web's two halves meet at the ridge at an angle; membrane
 * equilibrium there needs a downward line load 2|N_crown|·sin φ_crown
 * (ridge_load), which a masonry vault finds in its thickness or keystones.
 * @param options spans, shape, self-weight and loads (SI)
 * @returns the statics of one bay
 * @example groinVault({span_x: 8, g: 3600}).H_corner_x // g·R² = 57 600 N
 */
export function groinVault(options: GroinVaultOptions): GroinVault {
  const input = groinInput(options);
  const sec = groinSections(input.spanX, input.spanY, input.shape, input.t);
  const load = { x: webLoad(sec.x, input), y: webLoad(sec.y, input) };
  const ix = webIntegrals(sec.x, sec.y, load.x);
  const iy = webIntegrals(sec.y, sec.x, load.y);
  const W = 2 * (ix.load + iy.load);
  // The half vault on one side of a cut through the centre line of the `own` barrel's webs.
  const half = (own: BarrelSection, other: BarrelSection, ld: WebLoad, io: typeof ix, ia: typeof ix) => {
    const W_half = io.load + ia.load;
    const x_half = (2 * io.momentAlong + ia.momentAcross) / W_half;
    const c = own.phiCrown;
    const N_crown = -ld.q(c) * own.r * Math.cos(c);
    const thrust = -N_crown * Math.cos(c) * 2 * other.e;
    const h = (W_half * (own.e - x_half)) / thrust;
    return { W_half, x_half, N_crown, thrust, h, ridge: 2 * -N_crown * Math.sin(c) };
  };
  const hx = half(sec.x, sec.y, load.x, ix, iy);
  const hy = half(sec.y, sec.x, load.y, iy, ix);
  const result: Omit<GroinVault, 'model'> = {
    shape: input.shape,
    crown: sec.x.crown,
    area_web_x: ix.area, area_web_y: iy.area, area: 2 * (ix.area + iy.area),
    W,
    W_half: hx.W_half, x_half: hx.x_half, N_crown: hx.N_crown, thrust_cut: hx.thrust, h_thrust: hx.h,
    W_half_y: hy.W_half, x_half_y: hy.x_half, N_crown_y: hy.N_crown, thrust_cut_y: hy.thrust, h_thrust_y: hy.h,
    V_corner: W / 4,
    H_corner_x: hx.thrust / 2, H_corner_y: hy.thrust / 2, H_corner: Math.hypot(hx.thrust, hy.thrust) / 2,
    z_thrust: sec.x.crown - hx.h, z_thrust_y: sec.y.crown - hy.h,
    ridge_load_x: hx.ridge, ridge_load_y: hy.ridge,
  };
  const model: GroinModel = { input, x: { section: sec.x, load: load.x }, y: { section: sec.y, load: load.y } };
  return Object.defineProperty(result, 'model', { value: model, enumerable: false }) as GroinVault;
}
