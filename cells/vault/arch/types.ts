/**
 * The nouns of the arch limit-analysis kernel. Plain SI numbers throughout:
 * metres, newtons, radians, N/m^3. Coordinates inside the kernel: x
 * horizontal from the crown axis (right positive), y above the springing
 * point of the intrados. Results a document reads give positions from the
 * left springing of the intrados (the origin of P_at) and z above it.
 */
import type { Metres, Point, Profile, Radians } from '../profile.js';
import type { NotAvailable } from '../../not-available.js';

export type Newtons = number;

/** The two definitions of the geometric factor of safety t / t_min. */
export type GsfDefinition = 'loads_as_built' | 'ring_scaled';

/** A ring of masonry of constant thickness about a symmetric centreline, one strip deep. */
export interface ArchRing {
  shape: string;
  /** Clear span and rise of the intrados (m). */
  span: Metres;
  rise: Metres;
  /** Centreline radius of a circular ring (m); absent for other shapes. */
  radius?: Metres;
  /** Angle from the crown to the springing joint (rad). */
  half_angle: Radians;
  thickness: Metres;
  /** Unit weight of the masonry (N/m^3) and width of the strip (m). */
  unit_weight: number;
  depth: Metres;
  voussoirs: number;
  /** Self-weight of the whole ring strip (N). */
  weight: Newtons;
  /** Design compressive strength (Pa); Infinity when none is given (Heyman's rigid, uncrushable blocks). */
  f_c: number;
  /** Coefficient of friction at the joints; Infinity when none is given (no sliding). */
  friction: number;
  /** Which geometric factor of safety arch_limit reports. */
  gsf_definition: GsfDefinition;
  /** Centreline in the ring's frame (hidden from documents). */
  readonly centreline: Profile;
  /** 'exact' centroids of the voussoirs, or 'centreline' (the simplified published model); hidden. */
  readonly centroids: 'exact' | 'centreline';
  /** Joints from the left springing to the right one (hidden from documents). */
  readonly joints: readonly Joint[];
}

/** An axle or point load on the road surface: W (N) at `at` (m from the left springing of the intrados). */
export interface AxleLoad {
  W: Newtons;
  at: Metres;
}

/** Loads on a strip; plan loads per unit plan area, positions from the left springing of the intrados. */
export interface ArchLoads {
  fill_unit_weight?: number;
  fill_level?: Metres;
  dead?: number;
  live?: number;
  live_from?: Metres;
  live_to?: Metres;
  P?: Newtons;
  P_at?: Metres;
  /** Horizontal spread of a point load per unit depth of fill (0.5 for a 2 vertical : 1 horizontal spread); 0 = none. */
  spread?: number;
  /** Coefficient of horizontal fill pressure on the extrados (k·γ_fill·depth); 0 = none. */
  fill_pressure?: number;
  /** Kernel only: more point loads multiplied by λ (the axles of arch_scan). */
  axles?: AxleLoad[];
}

/**
 * A joint between voussoirs, normal to the centreline: mid-point on the
 * centreline, `u` the unit normal from intrados to extrados, `n` the unit
 * tangent pointing from the left springing towards the right.
 */
export interface Joint {
  angle: Radians;
  mid: Point;
  u: Point;
  n: Point;
}

/**
 * A section where admissibility is checked: a joint, or a vertical cut under
 * a point load (where the line of thrust kinks). The resultant must cross it
 * between mid − down·u and mid + up·u. For a cut, n = (1, 0) and u = (0, 1).
 */
export interface Section extends Joint {
  kind: 'joint' | 'cut';
  down: Metres;
  up: Metres;
  /** Angles of the ring at the section's intrados and extrados ends (equal to `angle` for a joint). */
  angleDown: Radians;
  angleUp: Radians;
}

/** A vertical force W (N) at x and a horizontal one Fx (N, +x) at height y. */
export interface VerticalLoad {
  W: Newtons;
  x: Metres;
  Fx?: Newtons;
  y?: Metres;
}

/**
 * Where a line of thrust touches a face of the ring (one per touching
 * region, at its deepest point): angle of the ring normal there from the
 * vertical (negative on the left half), face, position (x from the left
 * springing of the intrados, z above it), and the joint's normal force N
 * (compression positive) and tangential force T there.
 */
export interface Hinge {
  angle: Radians;
  face: 'intrados' | 'extrados';
  x: Metres;
  z: Metres;
  N: Newtons;
  T: Newtons;
}

/** The largest ratio of tangential to normal force at the joints in one state, and where. */
export interface SlidingRatio {
  state: string;
  ratio: number;
  angle: Radians;
  x: Metres;
  z: Metres;
}

/** What arch_limit reports: every field always present (Infinity when unbounded, NotAvailable when absent). */
export interface ArchLimit {
  H_min: Newtons | NotAvailable;
  H_max: Newtons | NotAvailable;
  V_left: Newtons | NotAvailable;
  V_right: Newtons | NotAvailable;
  t_min: Metres | NotAvailable;
  gsf: number;
  gsf_definition: string;
  hinges: Hinge[] | NotAvailable;
  load_factor: number | NotAvailable;
  mechanism: Hinge[] | NotAvailable;
  governs: string | NotAvailable;
  sigma_max: number | NotAvailable;
  sigma_max_at: Metres | NotAvailable;
  sliding: SlidingRatio[];
  load_spread: string;
  safe: boolean;
  notes: string[];
}
