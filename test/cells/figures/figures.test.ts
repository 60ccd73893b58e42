/**
 * Sources: each figure is checked against statics it must show. Force polygon: the pole distance is H
 * and the load line sums the voussoir weights, so H : ΣW = H_min : W (graphic statics, any statics text).
 * A symmetric ring has V = W/2 at each springing (equilibrium). Circular barrel under self-weight:
 * N_φ = −g·R at the crown (membrane theory of cylindrical shells, Flügge ch. 3 — from memory, as in
 * ../shared/REFERENCES.md). Buttress: where the resultant cuts the base (rigid-block statics).
 */
import { describe, expect, it } from 'vitest';
import { parse } from 'node-html-parser';
import { archRing } from '../../../cells/vault/arch/arch-ring.js';
import { archLimit } from '../vault/arch/loose-limit.js';
import { barrelMembrane } from '../../../cells/vault/barrel-membrane.js';
import { groinVault } from '../../../cells/vault/groin/groin-vault.js';
import { buttress } from '../../../cells/supports/buttress.js';
import { section } from '../../../cells/figures/section.js';
import { forcePolygon } from '../../../cells/figures/force-polygon.js';
import { membranePlot } from '../../../cells/figures/membrane-plot.js';
import { vaultPlan } from '../../../cells/figures/vault-plan.js';
import { supportFigure } from '../../../cells/figures/support-figure.js';
import { isFigure } from '../../../cells/figures/registry.js';
import { expectClose, numberField, listField } from '../../helpers/close.js';

// A fictional segmental ring: 6.4 m span, 1.6 m rise, 0.34 m thick, 18 kN/m³, 60 voussoirs to keep the tests quick.
const ring = archRing({ shape: 'circular', span: 6.4, rise: 1.6, thickness: 0.34, unit_weight: 18e3, voussoirs: 60 });
const limit = archLimit(ring);
const texts = (svg: string) => parse(svg).querySelectorAll('text').map((t) => t.text);
const num = (s: string | undefined) => Number(s);
/** A value to four significant figures without trailing zeros, as a figure drawn with the sheet's default writes it. */
const sf4 = (x: number) => String(+x.toPrecision(4)).replace('-', '−');

describe('section(ring, limit)', () => {
  const svg = section(ring, limit);

  it('section(ring, limit) is a recorded, deterministic SVG', () => {
    expect(isFigure(svg)).toBe(true);
    expect(section(ring, limit)).toBe(svg);
    expect(svg).not.toMatch(/NaN|Infinity|undefined/);
  });

  it('section draws both extreme thrust lines and one marker per hinge of the least-thrust line', () => {
    const root = parse(svg);
    expect(root.querySelectorAll('path').filter((p) => p.getAttribute('stroke-dasharray')).length).toBe(2);
    const hinges = root.querySelectorAll('circle').filter((c) => c.getAttribute('fill') === '#fff' && c.getAttribute('r') === '1.1');
    // Three hinges for the least-thrust line of a ring thicker than the least (Heyman, The Stone Skeleton, 1995, ch. 3),
    // the kernel reports them; the legend adds one more open circle.
    expect(listField(limit.hinges).length).toBe(3);
    expect(hinges.length).toBe(listField(limit.hinges).length + 1);
  });

  it('section writes H_min, H_max and the geometric factor of safety from the limit analysis', () => {
    const t = texts(svg);
    expect(t).toContain(`line of least thrust, H_min = ${sf4(numberField(limit.H_min) / 1000)} kN`);
    expect(t).toContain(`line of greatest thrust, H_max = ${sf4(numberField(limit.H_max) / 1000)} kN`);
    expect(t).toContain(`geometric factor of safety ${limit.gsf.toFixed(2)}`);
    expect(t).toContain('span 6.4 m');
    expect(t).toContain('rise 1.6 m');
  });

  it('section refuses a limit computed with other loads than those drawn', () => {
    const loaded = archLimit(ring, { dead: 8000 });
    expect(() => section(ring, loaded)).toThrow(/same ring and loads/);
    expect(() => section(ring, loaded, { dead: 8000 })).not.toThrow();
  });
});

describe('force_polygon(ring, limit)', () => {
  const svg = forcePolygon(ring, limit);
  const lines = parse(svg).querySelectorAll('line');
  const loadLine = lines.find((l) => l.getAttribute('stroke-width') === '0.7')!;
  const thrust = lines.find((l) => l.getAttribute('stroke-dasharray') === '1.5 0.8')!;

  it('force_polygon draws the load line ΣW long and the pole H from it, to one force scale', () => {
    const W = num(loadLine.getAttribute('y2')) - num(loadLine.getAttribute('y1'));
    const H = num(thrust.getAttribute('x2')) - num(thrust.getAttribute('x1'));
    // Under self-weight alone ΣW is the ring's weight (arch_ring); the drawing keeps H : ΣW.
    expectClose(H / W, numberField(limit.H_min) / ring.weight, 2e-3);
  });

  it('force_polygon puts the pole level with half the load for a symmetric ring (statics: V_left = V_right = W/2)', () => {
    const y1 = num(loadLine.getAttribute('y1')), y2 = num(loadLine.getAttribute('y2'));
    expectClose(num(thrust.getAttribute('y1')) - y1, (y2 - y1) / 2, 2e-3);
    expect(texts(svg)).toContain(`ΣW = ${sf4(ring.weight / 1000)} kN`);
  });

  it('force_polygon refuses reactions that do not match the loads', () => {
    expect(() => forcePolygon(ring, archLimit(ring, { dead: 8000 }))).toThrow(/same ring and loads/);
  });
});

describe('membrane_plot(m)', () => {
  // Circular barrel under self-weight g only: N_φ = −g·R·cos φ (Flügge, Stresses in Shells, ch. 3), −g·R at the crown.
  const m = barrelMembrane({ shape: 'circular', R0: 4, halfAngle: Math.PI / 3, length: 12, g: 2160 });
  const svg = membranePlot(m);

  it('membrane_plot draws three curves along the profile and three along the generatrix, and a legend for each', () => {
    const paths = parse(svg).querySelectorAll('path').filter((p) => p.getAttribute('stroke-linejoin') === 'round');
    expect(paths.length).toBe(6);
    expect(isFigure(svg)).toBe(true);
  });

  it('membrane_plot states the crown force of the kernel, −g·R for a circular barrel', () => {
    expectClose(m.N_phi_crown, -2160 * 4, 1e-9);
    expect(texts(svg).some((t) => t.includes('N_φ at crown −8.64 kN/m'))).toBe(true);
  });
});

describe('vault_plan(v)', () => {
  // Square bay, thin shell: H_corner_x = g·R² (kernel example, Heyman's cross-vault statics); the corner
  // resultant of two equal orthogonal thrusts is √2 times either (hand calculation).
  const v = groinVault({ span_x: 8, g: 3600 });
  const svg = vaultPlan(v);

  it('vault_plan labels the corner thrusts and their resultant', () => {
    const t = texts(svg);
    expect(t).toContain('H_x = 57.6 kN');
    expect(t).toContain('H_y = 57.6 kN');
    expect(t).toContain(`H = ${sf4(57.6 * Math.SQRT2)} kN`);
  });

  it('vault_plan draws four groins and a pier at each corner', () => {
    const root = parse(svg);
    expect(root.querySelectorAll('path').filter((p) => p.getAttribute('stroke-width') === '0.5').length).toBe(4);
    expect(root.querySelectorAll('rect').filter((r) => r.getAttribute('width') === '2.6').length).toBe(4);
    expect(svg).not.toMatch(/NaN|Infinity|undefined/);
  });
});

describe('support_figure(b, options)', () => {
  // 6 m × 1.5 m wall, 20 kN/m³, 10 kN at the top: W = 180 kN, x_R = 0.75 − 10·6/180 = 0.4167 m from the outer toe.
  const o = { height: 6, width: 1.5, depth: 1, unit_weight: 2e4, T: 1e4, z_T: 6 };
  const b = buttress(o);
  const svg = supportFigure(b, o);

  it('support_figure ends the path of the resultant where it cuts the base', () => {
    expectClose(b.x_R, 0.75 - 60 / 180, 1e-9);
    // The facts beside the drawing wrap to its room (issue 16: text at least 8 pt), so they are read joined.
    expect(texts(svg).join(' ')).toContain('resultant at the base: 0.4167 m from the outer toe,'); // 0.41667 m to four significant figures (the sheet's default)
    const path = parse(svg).querySelectorAll('path').find((p) => p.getAttribute('stroke') === '#a3162b' && !p.getAttribute('fill'))!;
    const pts = path.getAttribute('d')!.slice(1).split('L').map((s) => s.split(' ').map(Number));
    const [top, bottom] = [pts[0]!, pts[pts.length - 1]!];
    // Top of the path at the thrust's level (the top, z_T = 6 m) in the middle of the wall: the weight above is nil there.
    expect(bottom[1]! - top[1]!).toBeGreaterThan(0);
  });

  it('support_figure shows the middle third and says when the resultant leaves it', () => {
    const thirds = parse(svg).querySelectorAll('line').filter((l) => l.getAttribute('stroke-dasharray') === '1.6 1');
    expect(thirds.length).toBe(2 + 1); // two per block, one in the legend
    // e = 0.75 − 0.4167 = 0.333 m > B/6 = 0.25 m: outside the kern; with T = 5 kN, e = 0.167 m: inside.
    expect(texts(svg).join(' ')).toContain('OUTSIDE the middle third: part of the base lifts');
    const near = { ...o, T: 5e3 };
    expect(texts(supportFigure(buttress(near), near)).join(' ')).toContain('within the middle third of the base');
  });

  it('support_figure refuses options that do not describe the support', () => {
    expect(() => supportFigure(b, { ...o, width: 2 })).toThrow(/same options/);
  });
});

describe('vault_plan(v) of an oblong bay (issue 15)', () => {
  const v = groinVault({ span_x: 6.0, span_y: 4.2, thickness: 0.18, unit_weight: 18e3 });
  const svg = vaultPlan(v);
  it('dimensions the clear spans 6.00 × 4.20 m (not the middle surface 6.18 × 4.38 m) and draws both elevations', () => {
    const t = texts(svg);
    expect(t).toContain('clear 6 m (x)');
    expect(t).toContain('clear 4.2 m (y)');
    expect(t).toContain('clear 6 m');
    expect(t).toContain('clear 4.2 m');
    expect(t.some((x) => x.startsWith('H_x = '))).toBe(true);
    expect(t.some((x) => x.startsWith('H_y = '))).toBe(true);
    expect(t.filter((x) => x.startsWith('across the ')).length).toBe(2);
    expect(svg).not.toMatch(/NaN|Infinity|undefined/);
  });
});

describe('dome_figure, cross_vault_figure, flyer_figure (issue 15)', () => {
  it('dome_figure draws the shell, the hoop-tension zone from 51.8° and the lune\'s least-thrust line', async () => {
    const { dome } = await import('../../../cells/vault/dome/dome.js');
    const { domeLimit } = await import('../../../cells/vault/dome/dome-limit.js');
    const { domeFigure } = await import('../../../cells/figures/dome-figure.js');
    const d = dome({ radius: 8, half_angle: Math.PI / 2, thickness: 0.5, unit_weight: 18e3 });
    const svg = domeFigure(d, domeLimit(d));
    expect(isFigure(svg)).toBe(true);
    expect(texts(svg)).toContain('51.8°');
    expect(texts(svg).some((t) => t.startsWith('lunes, no hoop tension: t_min'))).toBe(true);
    expect(svg).not.toMatch(/NaN|undefined/);
  });

  it('cross_vault_figure dimensions the clear spans and marks each corner thrust at its height', async () => {
    const { crossVault } = await import('../../../cells/vault/groin/cross-vault.js');
    const { crossVaultFigure } = await import('../../../cells/figures/cross-vault-figure.js');
    const c = crossVault({ span_x: 6, span_y: 4.2, shape: 'pointed', thickness: 0.25, unit_weight: 18e3 });
    const t = texts(crossVaultFigure(c));
    expect(t).toContain('clear 6 m (x)');
    expect(t).toContain('clear 4.2 m (y)');
    // Each elevation's heading wraps to the elevation's width (text at least 8 pt), so it is read joined.
    expect(t.join(' ').match(/across the [xy]-span \(pointed\): H_[xy],min = .*? at z = /g)?.length).toBe(2);
  });

  it('cross_vault_figure of an oblong 4.2 × 6.0 m bay draws both elevations and dimensions the clear spans, not the middle surface\'s 4.38 × 6.18 m', async () => {
    const { crossVault } = await import('../../../cells/vault/groin/cross-vault.js');
    const { crossVaultFigure } = await import('../../../cells/figures/cross-vault-figure.js');
    const c = crossVault({ span_x: 4.2, span_y: 6.0, shape: 'pointed', thickness: 0.18, unit_weight: 18e3 });
    // The middle surface springs half a thickness outside each face of the supports (geometry): 4.2 + 0.18 and 6.0 + 0.18.
    expectClose(2 * c.model.x.e, 4.38, 1e-9);
    expectClose(2 * c.model.y.e, 6.18, 1e-9);
    const svg = crossVaultFigure(c);
    const t = texts(svg);
    expect(t).toEqual(expect.arrayContaining(['clear 4.2 m (x)', 'clear 6 m (y)', 'clear 4.2 m', 'clear 6 m']));
    expect(t.filter((x) => /4\.38|6\.18/.test(x))).toEqual([]);
    // Both elevations: a heading and a shell outline for each direction.
    expect(t.join(' ')).toMatch(/across the x-span .*across the y-span/);
    const root = parse(svg);
    expect(root.querySelectorAll('path').filter((p) => p.getAttribute('fill') === '#e4e7ea').length).toBe(2);
    // The dimension lines are drawn to the clear spans at the drawing's one scale: in plan 4.2 : 6.0 to each other and
    // 4.2 : 4.38 to the bay's outline through the middle surface's springings.
    const dims = root.querySelectorAll('g').filter((g) => g.getAttribute('stroke-width') === '0.18').map((g) => {
      const l = g.querySelectorAll('line')[2]!;
      return Math.hypot(num(l.getAttribute('x2')) - num(l.getAttribute('x1')), num(l.getAttribute('y2')) - num(l.getAttribute('y1')));
    });
    expect(dims.length).toBe(4); // plan x, plan y, elevation x, elevation y
    expectClose(dims[0]! / dims[1]!, 4.2 / 6.0, 2e-3);
    expectClose(dims[2]! / dims[3]!, 4.2 / 6.0, 2e-3);
    const bay = root.querySelectorAll('path').find((p) => p.getAttribute('fill') === '#f1f3f5')!;
    const xs = bay.getAttribute('d')!.match(/[ML](-?[\d.]+) /g)!.map((m) => Number(m.slice(1)));
    expectClose(dims[0]! / (Math.max(...xs) - Math.min(...xs)), 4.2 / 4.38, 2e-3);
  });

  it('flyer_figure shows both lines for an arched flyer and ∞ for a straight one', async () => {
    const { flyingButtress } = await import('../../../cells/supports/flyer.js');
    const { flyerFigure } = await import('../../../cells/figures/flyer-figure.js');
    const arched = flyerFigure(flyingButtress({ shape: 'arched', span: 4.5, rise: 2, sag: 0.5, thickness: 0.45, unit_weight: 22e3 }));
    expect(parse(arched).querySelectorAll('path').length).toBeGreaterThanOrEqual(3);
    const straight = texts(flyerFigure(flyingButtress({ span: 4, rise: 2, thickness: 0.4, unit_weight: 2e4 })));
    expect(straight.some((x) => x.startsWith('greatest thrust ∞'))).toBe(true);
  });
});
