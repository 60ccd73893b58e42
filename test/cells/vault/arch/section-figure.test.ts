// The section figure draws what arch_limit analysed; checked on the SVG itself (no outside source needed:
// these are facts of the drawing, not of engineering).
import { describe, it, expect } from 'vitest';
import { parse } from 'node-html-parser';
import { archRing } from '../../../../cells/vault/arch/arch-ring.js';
import { archLimit } from './loose-limit.js';
import { archScan } from '../../../../cells/vault/arch/arch-scan.js';
import { section } from '../../../../cells/figures/section.js';
import { scanPlot } from '../../../../cells/figures/scan-plot.js';
import { TEXT_SIZE } from '../../../../cells/figures/svg.js';

const ring = archRing({ shape: 'circular', span: 6, rise: 1.5, thickness: 0.34, unit_weight: 18e3, voussoirs: 80 });
/** A value to four significant figures without trailing zeros, as a figure drawn with the sheet's default writes it. */
const sf4 = (x: number) => (Math.abs(x) < 1e-10 ? '0' : String(+x.toPrecision(4))); // a hinge at the springing is at round-off from 0
const loads = { fill_unit_weight: 19e3, fill_level: 2.24, dead: 2.3e3, spread: 0.5, live: 4e3, live_from: 3, live_to: 6, axles: [{ W: 50e3, at: 2.2 }, { W: 50e3, at: 0.4 }] };

/** Boxes of the text labels, from their position, anchor and length (the figure's own estimate of glyph width). */
function labelBoxes(svg: string) {
  return parse(svg).querySelectorAll('text').filter((t) => t.getAttribute('stroke') === '#fff').map((t) => {
    const x = Number(t.getAttribute('x')), y = Number(t.getAttribute('y'));
    const w = t.text.length * TEXT_SIZE * 0.52;
    const anchor = t.getAttribute('text-anchor');
    const x0 = anchor === 'end' ? x - w : anchor === 'middle' ? x - w / 2 : x;
    return { text: t.text, x0, x1: x0 + w, y0: y - TEXT_SIZE, y1: y + 0.8, rotated: t.getAttribute('transform') !== undefined };
  });
}

describe('section(ring, limit, loads) draws what was analysed', () => {
  const a = archLimit(ring, loads);
  const svg = section(ring, a, loads);
  const texts = parse(svg).querySelectorAll('text').map((t) => t.text);

  it('fill level, dead load, live load and each axle with its value', () => {
    // Written to the sheet's default 4 significant figures, trailing zeros dropped (engine/values/format.ts).
    expect(texts).toContain('fill level 2.24 m, 19 kN/m³');
    expect(texts).toContain('dead 2.3 kN/m² on plan');
    expect(texts).toContain('live 4 kN/m² (× λ)');
    expect(texts.filter((t) => t === '50 kN').length).toBe(2);
  });

  it('the line at collapse and one numbered marker per hinge of the mechanism, listed with its face', () => {
    expect(a.mechanism.length).toBeGreaterThanOrEqual(4);
    for (let k = 1; k <= a.mechanism.length; k++) expect(texts).toContain(String(k));
    // The list wraps under the drawing (at the least print size): its lines, joined where they broke.
    const at = texts.findIndex((t) => t.startsWith('mechanism:'));
    expect(at).toBeGreaterThanOrEqual(0);
    const list = texts.slice(at, at + 3).join(' ');
    for (const h of a.mechanism) expect(list).toContain(`${h.face} x ${sf4(h.x)} m`);
    expect(svg).toContain('0.9 0.7'); // the dash of the line at collapse
    expect(texts.some((t) => t.startsWith('gsf: loads as built'))).toBe(true);
  });

  // In US customary units the labels are longer ("t = 1.115 ft", "9.01 kip"): placed as well.
  const usUnits = { sigfigs: 4, units: { length: 'ft', force: 'kip', 'force per length': 'kip/ft', pressure: 'psf', 'unit weight': 'pcf' } };
  it.each([['SI', svg], ['US customary', section(ring, a, loads, usUnits)]])('no two labels overlap (%s units)', (_, drawn) => {
    const boxes = labelBoxes(drawn).filter((b) => !b.rotated);
    expect(boxes.length).toBeGreaterThan(6);
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) {
        const [p, q] = [boxes[i]!, boxes[j]!];
        const overlap = p.x0 < q.x1 && q.x0 < p.x1 && p.y0 < q.y1 && q.y0 < p.y1;
        expect(overlap, `"${p.text}" and "${q.text}"`).toBe(false);
      }
    }
  });
});

describe('scan_plot(s)', () => {
  it('plots λ against the lead axle\'s position and marks the worst position with its values', () => {
    const s = archScan(ring, { fill_unit_weight: 19e3, fill_level: 2.24 }, { axles: [50e3, 50e3], spacing: [1.8], steps: 20 });
    const svg = scanPlot(s);
    const t = parse(svg).querySelectorAll('text').map((e) => e.text);
    expect(t).toContain(`worst: λ = ${(s.lambda_min as number).toFixed(2)} at x = ${sf4(s.x_worst as number)} m`);
    expect(svg).not.toMatch(/NaN|undefined/);
  });
});
