/**
 * The nouns of the arch limit-analysis kernel. Plain SI numbers throughout:
 * metres, newtons, radians, N/m^3. Coordinates: x horizontal from the crown
 * axis (right positive), y above the springing point of the intrados.
 */
import type { Metres, Point, Profile, Radians } from '../profile.js';
import type { NotAvailable } from '../../not-available.js';

export type Newtons = number;

/** A ring of masonry of constant thickness about a symmetric centreline, one strip deep. */
export interface ArchRing {
  shape: string;
  /** Clear span and rise of the intrados (m). */
  span: Metres;
  rise: Metres;
  /** Centreline radius of a circular ring (m); not available for other shapes. */
  radius: Metres | NotAvailable;
  /** Angle from the crown to the springing joint (rad). */
  half_angle: Radians;
  thickness: Metres;
  /** Unit weight of the masonry (N/m^3) and width of the strip (m). */
  unit_weight: number;
  depth: Metres;
  voussoirs: number;
  /** Self-weight of the whole ring strip (N). */
  weight: Newtons;
  /** Centreline in the ring's frame (hidden from documents). */
  readonly centreline: Profile;
  /** 'exact' centroids of the voussoirs, or 'centreline' (the simplified published model); hidden. */
  readonly centroids: 'exact' | 'centreline';
  /** Joints from the left springing to the right one (hidden from documents). */
  readonly joints: readonly Joint[];
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

/** A vertical downward force W (N) whose line of action is at x (m). */
export interface VerticalLoad {
  W: Newtons;
  x: Metres;
}

/** Where a thrust line touches a face of the ring. */
export interface Hinge {
  angle: Radians;
  face: 'intrados' | 'extrados';
}

/**
 * What arch_limit reports. Every field is present: an unbounded quantity is Infinity, one that does
 * not exist in the state found is NotAvailable with the reason (also given in notes).
 */
export interface ArchLimit {
  H_min: Newtons | NotAvailable;
  H_max: Newtons | NotAvailable;
  V_left: Newtons | NotAvailable;
  V_right: Newtons | NotAvailable;
  t_min: Metres | NotAvailable;
  gsf: number;
  hinges: Hinge[] | NotAvailable;
  load_factor: number | NotAvailable;
  mechanism: Hinge[] | NotAvailable;
  safe: boolean;
  notes: string[];
}
