import { describe, it, expect } from 'vitest';
import { parse } from 'node-html-parser';
import { figureInUsUnits } from '../../../engine/render/figure-units.js';
import { renderText } from './helpers.js';

describe('figures in the document\'s units', () => {
  it('figureInUsUnits converts every quantity a figure writes, to at most three significant figures', () => {
    // 1 ft = 0.3048 m, 1 kip = 4.448222 kN, 1 psf = 47.880 Pa (NIST SP 811, Appendix B).
    const svg = '<svg><text x="1" y="2">span 6.40 m</text><text x="1" y="5">H = 77.0 kN</text><text>−35.2 kN/m</text><text>max 147 kN/m², t = 0.215 m</text><text>0</text></svg>';
    expect(figureInUsUnits(svg, 4)).toBe('<svg><text x="1" y="2">span 21 ft</text><text x="1" y="5">H = 17.3 kip</text><text>−2.41 kip/ft</text>'
      + '<text>max 3070 psf, t = 0.705 ft</text><text>0</text></svg>');
  });

  it('renderSheet shows the figure of a calc written in ft, kip and pcf in those units (fictional arch)', async () => {
    const source = [
      '```given', 'L_s = 20 ft   # span', 'f_r = 5 ft    # rise', 't_r = 1.25 ft # ring thickness', 'w_u = 120 pcf # brick, fictional', 'd_r = 3 ft    # depth', '```',
      '```calc', 'r = arch_ring({shape: "circular", span: L_s, rise: f_r, thickness: t_r, unit_weight: w_u, depth: d_r})', 'a = arch_limit(r)', '```',
      '```figure', 'section(r, a)   # the ring', '```', '',
    ].join('\n');
    const r = await renderText(source, { file: 'us.md' });
    const texts = parse(r.html).querySelectorAll('.vb-svg text').map((t) => t.text).join(' | ');
    expect(texts).toMatch(/\d ft\b/);
    expect(texts).toMatch(/\d kip\b/);
    expect(texts).not.toMatch(/\d (m|kN)\b/);
  });
});
