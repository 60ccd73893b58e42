/**
 * How a figure writes its quantities: the units of each kind and the significant figures, chosen by
 * the sheet (engine/render/figure.ts passes the document's), and the one number formatter of every
 * output (cells/format-number.ts). Figure functions take SI numbers (m, N, N/m, Pa, N/m³) and write
 * them only through a Readout, so a calc in ft, kip and psf gets its figures in those.
 */
import { math } from '../math.js';
import { formatNumber } from '../format-number.js';

/** The kinds of quantity a figure writes, each with the SI unit a kernel hands it in. */
export const FIGURE_KINDS = { length: 'm', force: 'N', 'force per length': 'N/m', pressure: 'Pa', 'unit weight': 'N/m^3' } as const;
export type FigureKind = keyof typeof FIGURE_KINDS;

/** What the sheet asks of a figure: significant figures and, per kind, a unit mathjs knows ('kN/m^2', 'kip/ft'). */
export interface FigureUnits {
  sigfigs: number;
  units: Record<FigureKind, string>;
}

/** What a figure function draws with unless the sheet asks otherwise: SI engineering units, 4 significant figures (the sheet's default). */
export const SI_FIGURE_UNITS: FigureUnits = {
  sigfigs: 4,
  units: { length: 'm', force: 'kN', 'force per length': 'kN/m', pressure: 'kN/m^2', 'unit weight': 'kN/m^3' },
};

/** Do two requests draw the same figure? */
export function sameFigureUnits(a: FigureUnits, b: FigureUnits): boolean {
  return a.sigfigs === b.sigfigs && (Object.keys(FIGURE_KINDS) as FigureKind[]).every((k) => a.units[k] === b.units[k]);
}

export interface Readout {
  /** A length as label text: "0.215 m", "21 ft". */
  length(si: number): string;
  /** A force: "77 kN", "17.3 kip". */
  force(si: number): string;
  /** A force per length: "−35.2 kN/m", "−2.41 kip/ft". */
  line(si: number): string;
  /** A pressure: "147 kN/m²", "3070 psf". */
  pressure(si: number): string;
  /** A unit weight: "18 kN/m³", "115 pcf". */
  weight(si: number): string;
  /** Any kind, as label text. */
  text(kind: FigureKind, si: number): string;
  /** The number an SI value is in the kind's display unit (for plot axes). */
  value(kind: FigureKind, si: number): number;
  /** The display unit as printed: "kN/m²", "ft". */
  unit(kind: FigureKind): string;
  /** How many display units make one SI unit (for scale bars: 1/0.3048 ft per m). */
  perSI(kind: FigureKind): number;
  /** The request it was made from. */
  request: FigureUnits;
}

const POWERS: Record<string, string> = { '^2': '²', '^3': '³' };

/** A unit as a label prints it: "kN/m^2" → "kN/m²", "kip ft" as written. */
function printed(unit: string): string {
  return unit.replace(/\^[23]/g, (p) => POWERS[p]!);
}

/**
 * The readout for a request.
 * @example readout(SI_FIGURE_UNITS).length(0.215) // "0.215 m"
 */
export function readout(request: FigureUnits = SI_FIGURE_UNITS): Readout {
  const per = {} as Record<FigureKind, number>;
  for (const kind of Object.keys(FIGURE_KINDS) as FigureKind[]) {
    // Factors from mathjs's unit definitions (NIST SP 811 for the US units cells/math.ts adds).
    let one = NaN;
    try { one = math.unit(1, request.units[kind]).toNumber(FIGURE_KINDS[kind]); } catch { /* not a unit of this kind */ }
    if (!Number.isFinite(one) || one <= 0) throw new TypeError(`readout: ${request.units[kind]} is not a unit of ${kind}`);
    per[kind] = 1 / one;
  }
  const value = (kind: FigureKind, si: number) => si * per[kind];
  const text = (kind: FigureKind, si: number) => `${formatNumber(value(kind, si), request.sigfigs)} ${printed(request.units[kind])}`;
  return {
    length: (si) => text('length', si),
    force: (si) => text('force', si),
    line: (si) => text('force per length', si),
    pressure: (si) => text('pressure', si),
    weight: (si) => text('unit weight', si),
    text, value,
    unit: (kind) => printed(request.units[kind]),
    perSI: (kind) => per[kind],
    request,
  };
}
