/**
 * The sheet's appendix "What drives each check" (render --drivers).
 * H = w·L²/(8·f): the thrust of a parabolic arch under a uniform load (common practice).
 */
import { describe, it, expect } from 'vitest';
import { evaluateDocument } from '../../../engine/index.js';
import { explainDocument } from '../../../engine/drivers/index.js';
import { renderSheet } from '../../../engine/render/index.js';
import { renderDriversAppendix } from '../../../engine/render/drivers.js';
import { fence } from '../../helpers/settle.js';

const ARCH = [
  fence('given', 'w = 12 kN/m', 'L = 6 m', 'f = 1.5 m', 'H_Rd = 60 kN', 'g1 = 1', 'g2 = 1', 'g3 = 1', 'g4 = 1'),
  fence('calc', 'H = g1 * g2 * g3 * g4 * w * L^2 / (8 * f) to kN'),
  fence('check', 'c_H = H <= H_Rd  # tie', 'c_L = L > 5.5 m'),
].join('\n');

describe('renderDriversAppendix', () => {
  it('renderDriversAppendix shows the top inputs of each check in swing order, with a bar and the caption naming both measures', async () => {
    const { checks } = await explainDocument(ARCH, { file: 'arch.md' });
    const html = renderDriversAppendix(checks);
    expect(html).toContain('What drives each check');
    expect(html).toMatch(/swing.*−10 % and \+10 %/s);
    expect(html).toContain('d ln u / d ln x');
    const cH = html.slice(html.indexOf('c_H: H &lt;= H_Rd'), html.indexOf('c_L'));
    const order = [...cH.matchAll(/<tr><td><code>([^<]+)<\/code>/g)].map((m) => m[1]);
    expect(order).toEqual(['L', 'f', 'H_Rd', 'w', 'g1']);
    expect(cH).toContain('and 3 more inputs of smaller swing');
    expect(cH.match(/<svg class="vb-swing"/g)).toHaveLength(5);
    // L: 0.6 · 0.81 and 0.6 · 1.21
    expect(cH).toMatch(/<code>L<\/code>.*?<td class="vb-num">0\.486<\/td><td class="vb-num">0\.726<\/td>/);
    // A plain comparison shows its verdict at ±10 % instead of a bar.
    const cL = html.slice(html.indexOf('c_L'));
    expect(cL).toMatch(/<code>L<\/code>.*<strong>fails<\/strong><\/td><td class="vb-num">holds/);
  });

  it('renderSheet adds the appendix only when drivers are given', async () => {
    const { doc, states, cases } = await evaluateDocument(ARCH, { file: 'arch.md' });
    const { checks } = await explainDocument(ARCH, { file: 'arch.md' });
    expect(renderSheet({ doc, states, cases })).not.toContain('data-part="drivers"');
    expect(renderSheet({ doc, states, cases, drivers: checks })).toContain('data-part="drivers"');
  });
});
