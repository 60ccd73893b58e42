/**
 * Every quantity a figure writes, in the units and significant figures the sheet asks for (issue 16).
 *
 * Unit factors, written here independently of cells/math.ts: NIST SP 811 (2008), Appendix B —
 * 1 ft = 0.3048 m exactly; 1 lbf = 4.4482216152605 N exactly (0.45359237 kg × 9.80665 m/s²);
 * 1 kip = 1000 lbf; psf = lbf/ft², pcf = lbf/ft³, kip/ft = kip/ft.
 * Rounding: the sheet's rule (engine/values/format.ts): `sigfigs` significant figures of the decimal
 * value, trailing zeros dropped — so 0.215 m prints "0.215" at 3 and also at 4 (not "0.2150"), and
 * "0.22" at 2 (0.215 rounds half up as written, not as the double 0.21499…).
 * The statics behind the values, as in figures.test.ts:
 * - N_φ = −g·R at the crown of a circular barrel under self-weight: −2.16 kN/m² × 4 m = −8.64 kN/m (membrane
 *   theory of cylindrical shells, Flügge ch. 3 — from memory).
 * - H_x = g·R² at a square groin vault's corner, and its resultant √2·H_x (the groin_vault kernel's closed form,
 *   tested against its source in test/cells/vault/groin/).
 * - A wall 6 m × 1.5 m × 1 m at 20 kN/m³ weighs N = 180 kN; with T = 10 kN at 6 m the resultant cuts the base at
 *   x_R = 0.75 − 60/180 = 0.41667 m from the outer toe, and the greatest base pressure is 288 kN/m² (rigid-block
 *   statics of a rectangular base, common practice).
 * - Spans, rises, thicknesses and radii are the inputs themselves; ring weights and H_min come from the kernels
 *   and are only re-rounded here.
 */
import { describe, expect, it } from 'vitest';
import { parse } from 'node-html-parser';
import { archRing } from '../../../cells/vault/arch/arch-ring.js';
import { archLimit } from '../vault/arch/loose-limit.js';
import { archScan } from '../../../cells/vault/arch/arch-scan.js';
import { barrelMembrane } from '../../../cells/vault/barrel-membrane.js';
import { groinVault } from '../../../cells/vault/groin/groin-vault.js';
import { crossVault } from '../../../cells/vault/groin/cross-vault.js';
import { dome } from '../../../cells/vault/dome/dome.js';
import { buttress } from '../../../cells/supports/buttress.js';
import { flyingButtress } from '../../../cells/supports/flyer.js';
import { section } from '../../../cells/figures/section.js';
import { forcePolygon } from '../../../cells/figures/force-polygon.js';
import { membranePlot } from '../../../cells/figures/membrane-plot.js';
import { vaultPlan } from '../../../cells/figures/vault-plan.js';
import { supportFigure } from '../../../cells/figures/support-figure.js';
import { scanPlot } from '../../../cells/figures/scan-plot.js';
import { domeFigure } from '../../../cells/figures/dome-figure.js';
import { crossVaultFigure } from '../../../cells/figures/cross-vault-figure.js';
import { flyerFigure } from '../../../cells/figures/flyer-figure.js';
import { figureIn, isFigure } from '../../../cells/figures/registry.js';
import { readout, SI_FIGURE_UNITS, type FigureUnits } from '../../../cells/figures/readout.js';
import { numberField } from '../../helpers/close.js';

const FT = 0.3048;
const LBF = 4.4482216152605;
const KIP = 1000 * LBF;

const si = (sigfigs: number): FigureUnits => ({ sigfigs, units: SI_FIGURE_UNITS.units });
const us = (sigfigs: number): FigureUnits => ({ sigfigs, units: { length: 'ft', force: 'kip', 'force per length': 'kip/ft', pressure: 'psf', 'unit weight': 'pcf' } });
const texts = (svg: string) => parse(svg).querySelectorAll('text').map((t) => t.text);
const joined = (svg: string) => texts(svg).join(' | ');
/** x to n significant figures, trailing zeros dropped (an independent statement of the sheet's rule, for values not at a tie). */
const sig = (x: number, n: number) => String(+x.toPrecision(n)).replace('-', '−');
/** A metric unit anywhere in a figure's words: "6.4 m", "(m)", "kN", "kN/m²". */
const METRIC = /\bkN\b|\d m\b|\(m\)|\bm\)|kN\/m/;

// Fictional members, as in figures.test.ts.
const ring = archRing({ shape: 'circular', span: 6.4, rise: 1.6, thickness: 0.215, unit_weight: 18e3, voussoirs: 40 });
const limit = archLimit(ring);
const membrane = barrelMembrane({ shape: 'circular', R0: 4, halfAngle: Math.PI / 3, length: 12, g: 2160 });
const groin = groinVault({ span_x: 8, g: 3600 });
const wallOptions = { height: 6, width: 1.5, depth: 1, unit_weight: 2e4, T: 1e4, z_T: 6 };
const wall = buttress(wallOptions);
const domeShell = dome({ radius: 8, half_angle: Math.PI / 2, thickness: 0.5, unit_weight: 18e3 });
const cross = crossVault({ span_x: 6, span_y: 4.2, shape: 'pointed', thickness: 0.25, unit_weight: 18e3 });
const flyer = flyingButtress({ shape: 'arched', span: 4.5, rise: 2, sag: 0.5, thickness: 0.45, unit_weight: 22e3 });
const scanRing = archRing({ shape: 'circular', span: 6, rise: 1.5, thickness: 0.34, unit_weight: 18e3, voussoirs: 30 });
const scan = archScan(scanRing, {}, { axles: [60e3], steps: 8 });

/** Each figure kind with its drawing function. */
const FIGURES: Array<[string, (u: FigureUnits) => string]> = [
  ['section', (u) => section(ring, limit, {}, u)],
  ['force_polygon', (u) => forcePolygon(ring, limit, {}, u)],
  ['membrane_plot', (u) => membranePlot(membrane, u)],
  ['vault_plan', (u) => vaultPlan(groin, u)],
  ['support_figure', (u) => supportFigure(wall, wallOptions, u)],
  ['scan_plot', (u) => scanPlot(scan, u)],
  ['dome_figure', (u) => domeFigure(domeShell, undefined, u)],
  ['cross_vault_figure', (u) => crossVaultFigure(cross, u)],
  ['flyer_figure', (u) => flyerFigure(flyer, u)],
];

describe('readout(units)', () => {
  it('readout(SI, 3) writes a 0.215 m ring as 0.215 m (three significant figures), not 0.21 m', () => {
    expect(readout(si(3)).length(0.215)).toBe('0.215 m');
  });

  it('readout writes 0.215 m as "0.22 m" at 2, "0.215 m" at 4 (no trailing zero added) and "0.7054 ft" at 4 in feet', () => {
    expect(readout(si(2)).length(0.215)).toBe('0.22 m');
    expect(readout(si(4)).length(0.215)).toBe('0.215 m');
    expect(readout(us(4)).length(0.215)).toBe('0.7054 ft'); // 0.215 / 0.3048 = 0.70538 ft
  });

  it('readout converts each kind with the NIST SP 811 factors', () => {
    const r = readout(us(6));
    expect(r.force(10e3)).toBe(`${sig(10e3 / KIP, 6)} kip`);
    expect(r.line(-8640)).toBe(`${sig(-8640 / (KIP / FT), 6)} kip/ft`);
    expect(r.pressure(288e3)).toBe(`${sig(288e3 / (LBF / FT ** 2), 6)} psf`);
    expect(r.weight(18e3)).toBe(`${sig(18e3 / (LBF / FT ** 3), 6)} pcf`);
    expect(r.perSI('length')).toBeCloseTo(1 / FT, 12);
  });

  it('readout refuses a unit of another kind', () => {
    expect(() => readout({ sigfigs: 3, units: { ...us(3).units, length: 'kip' } })).toThrow(TypeError);
  });
});

describe.each([2, 3, 4])('figures at %i significant figures', (n) => {
  it(`section labels span, rise, t and H_min to ${n} significant figures`, () => {
    const t = texts(section(ring, limit, {}, si(n)));
    expect(t).toContain(`span ${sig(6.4, n)} m`);
    expect(t).toContain(`rise ${sig(1.6, n)} m`);
    expect(t).toContain(`t = ${{ 2: '0.22', 3: '0.215', 4: '0.215' }[n]} m`);
    expect(t).toContain(`line of least thrust, H_min = ${sig(numberField(limit.H_min) / 1000, n)} kN`);
  });

  it(`force_polygon writes ΣW = the ring's weight to ${n} significant figures`, () => {
    expect(texts(forcePolygon(ring, limit, {}, si(n)))).toContain(`ΣW = ${sig(ring.weight / 1000, n)} kN`);
  });

  it(`membrane_plot writes N_φ at the crown, −g·R = −8.64 kN/m, to ${n} significant figures`, () => {
    expect(joined(membranePlot(membrane, si(n)))).toContain(`N_φ at crown ${{ 2: '−8.6', 3: '−8.64', 4: '−8.64' }[n]} kN/m`);
  });

  it(`vault_plan writes H_x = g·R² = 57.6 kN and the corner resultant √2 · 57.6 kN to ${n} significant figures`, () => {
    const t = texts(vaultPlan(groin, si(n)));
    expect(t).toContain(`H_x = ${{ 2: '58', 3: '57.6', 4: '57.6' }[n]} kN`);
    expect(t).toContain(`H = ${{ 2: '81', 3: '81.5', 4: '81.46' }[n]} kN`);
  });

  it(`support_figure writes x_R = 0.41667 m and N = 180 kN to ${n} significant figures`, () => {
    // The facts beside the drawing wrap to its room, so they are read joined by spaces.
    const t = texts(supportFigure(wall, wallOptions, si(n))).join(' ');
    expect(t).toContain(`resultant at the base: ${{ 2: '0.42', 3: '0.417', 4: '0.4167' }[n]} m from the outer toe`);
    expect(t).toContain(`N = ${{ 2: '180', 3: '180', 4: '180' }[n]} kN`);
  });

  it(`scan_plot writes the worst position to ${n} significant figures`, () => {
    expect(joined(scanPlot(scan, si(n)))).toContain(`at x = ${sig(numberField(scan.x_worst), n)} m`);
  });

  it(`dome_figure writes the middle-surface radius 8 m and the clear span to ${n} significant figures`, () => {
    const t = joined(domeFigure(domeShell, undefined, si(n)));
    expect(t).toContain(`middle surface: radius ${sig(8, n)} m`);
    expect(t).toContain(`clear span ${sig(2 * (8 - 0.25), n)} m`); // intrados radius 8 − t/2 = 7.75 m
  });

  it(`cross_vault_figure writes the clear spans 6 m and 4.2 m to ${n} significant figures`, () => {
    const t = texts(crossVaultFigure(cross, si(n)));
    expect(t).toContain(`clear ${sig(6, n)} m (x)`);
    expect(t).toContain(`clear ${sig(4.2, n)} m (y)`);
  });

  it(`flyer_figure writes the span 4.5 m and the weight to ${n} significant figures`, () => {
    const t = joined(flyerFigure(flyer, si(n)));
    expect(t).toContain(`span ${sig(4.5, n)} m`);
    expect(t).toContain(`weight ${sig(flyer.W / 1000, n)} kN`);
  });
});

describe.each([2, 3, 4])('figures in US customary units at %i significant figures', (n) => {
  it.each(FIGURES)('%s writes no metre or kilonewton', (_, draw) => {
    const svg = draw(us(n));
    expect(isFigure(svg)).toBe(true);
    expect(joined(svg)).not.toMatch(METRIC);
    expect(svg).not.toMatch(/NaN|undefined/);
  });

  it('section labels t = 0.215 m and the span 6.4 m in feet, H_min in kip, the scale bar in ft', () => {
    const t = texts(section(ring, limit, {}, us(n)));
    expect(t).toContain(`t = ${{ 2: '0.71', 3: '0.705', 4: '0.7054' }[n]} ft`); // 0.215 / 0.3048
    expect(t).toContain('span 21 ft'); // 6.4 / 0.3048 = 20.997 ft
    expect(t).toContain(`line of least thrust, H_min = ${sig(numberField(limit.H_min) / KIP, n)} kip`);
    expect(t.some((x) => /^\d+(\.\d+)? ft$/.test(x))).toBe(true);
  });

  it('membrane_plot writes N_φ at the crown in kip/ft and labels its force axes in kip/ft', () => {
    const svg = membranePlot(membrane, us(n));
    expect(joined(svg)).toContain(`N_φ at crown ${{ 2: '−0.59', 3: '−0.592', 4: '−0.592' }[n]} kip/ft`); // 8640 N/m / 14593.9 N/m per kip/ft
    expect(texts(svg).filter((x) => x === 'kip/ft').length).toBe(2);
    expect(joined(svg)).toContain('x from mid-length (ft)');
  });

  it('vault_plan writes H_x = 57.6 kN as kip', () => {
    expect(texts(vaultPlan(groin, us(n)))).toContain(`H_x = ${{ 2: '13', 3: '12.9', 4: '12.95' }[n]} kip`); // 57600 / 4448.22
  });

  it('support_figure writes x_R in ft, N in kip and the base pressure in psf', () => {
    const t = texts(supportFigure(wall, wallOptions, us(n))).join(' ');
    expect(t).toContain(`resultant at the base: ${{ 2: '1.4', 3: '1.37', 4: '1.367' }[n]} ft`); // 0.41667 / 0.3048
    expect(t).toContain(`N = ${{ 2: '40', 3: '40.5', 4: '40.47' }[n]} kip`); // 180 kN / 4.44822
    expect(t).toContain(`base pressure: max ${{ 2: '6000', 3: '6020', 4: '6015' }[n]} psf`); // 288 kN/m² / 47.880 Pa
  });

  it('scan_plot gives the worst position in ft and its axis in ft', () => {
    const svg = scanPlot(scan, us(n));
    expect(joined(svg)).toContain(`at x = ${sig(numberField(scan.x_worst) / FT, n)} ft`);
    expect(joined(svg)).toContain('intrados (ft)');
  });

  it('dome_figure, cross_vault_figure and flyer_figure write their lengths in ft', () => {
    expect(joined(domeFigure(domeShell, undefined, us(n)))).toContain(`middle surface: radius ${{ 2: '26', 3: '26.2', 4: '26.25' }[n]} ft`); // 8 / 0.3048
    expect(texts(crossVaultFigure(cross, us(n)))).toContain(`clear ${{ 2: '20', 3: '19.7', 4: '19.69' }[n]} ft (x)`); // 6 / 0.3048
    expect(joined(flyerFigure(flyer, us(n)))).toContain(`span ${{ 2: '15', 3: '14.8', 4: '14.76' }[n]} ft`); // 4.5 / 0.3048
  });
});

describe('figureIn(svg, units)', () => {
  it.each(FIGURES)('figureIn draws %s again in the units asked for, and keeps the figure itself when drawn so', (_, draw) => {
    const svg = draw(SI_FIGURE_UNITS);
    expect(figureIn(svg, si(4))).toBe(svg);
    expect(figureIn(svg, us(3))).toBe(draw(us(3)));
  });

  it('figureIn refuses a string no figure function made', () => {
    expect(() => figureIn('<svg onload="alert(1)"></svg>', si(3))).toThrow(TypeError);
  });
});
