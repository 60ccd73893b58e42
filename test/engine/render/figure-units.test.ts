/**
 * A calc written in ft, kip, pcf and psf gets its figures, result panels, JSON values and diff in those
 * units (issue 16). Unit factors for the hand values: NIST SP 811 (2008), Appendix B — 1 ft = 0.3048 m,
 * 1 lbf = 4.4482216152605 N, 1 kip = 1000 lbf (exact).
 */
import { describe, it, expect } from 'vitest';
import { parse } from 'node-html-parser';
import { mkdtemp, writeFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { renderText } from './helpers.js';
import { figureUnitsFor } from '../../../engine/render/figure-units.js';
import { summarise } from '../../../engine/summary.js';
import { diffCommand } from '../../../bin/commands/diff.js';

const KIP = 4448.2216152605;

/** A fictional carriage-house arch and its wall, written in US customary units. */
const US_CALC = (span: string) => [
  '---', 'title: Carriage-house arch (fictional demo in US units)', 'sigfigs: 3', '---', '',
  '```given',
  `L_s = ${span}     # clear span (fictional)`,
  'f_r = 5 ft      # rise',
  't_r = 1.25 ft   # ring thickness',
  'w_u = 120 pcf   # brick (fictional)',
  'd_r = 3 ft      # depth of the strip',
  'q_d = 50 psf    # dead load on plan (fictional)',
  'h_w = 18 ft     # wall height',
  'b_w = 7 ft      # wall width',
  'T_w = 2 kip     # thrust on the wall (fictional)',
  'g_s = 45 psf    # barrel shell weight (fictional)',
  '```', '',
  '```calc',
  'r = arch_ring({shape: "circular", span: L_s, rise: f_r, thickness: t_r, unit_weight: w_u, depth: d_r})',
  'a = arch_limit(r, {dead: q_d})',
  'H = a.H_min        # least thrust',
  'opts = {height: h_w, width: b_w, depth: d_r, unit_weight: w_u, T: T_w, z_T: h_w}',
  'b = buttress(opts)',
  'vb = barrel_membrane({shape: "circular", span: L_s, rise: f_r, length: 30 ft, g: g_s})',
  'd = dome({radius: 15 ft, half_angle: 60 deg, thickness: t_r, unit_weight: w_u})',
  '```', '',
  '```figure',
  'section(r, a)          # the ring',
  'force_polygon(r, a)    # its force polygon',
  'support_figure(b, opts)   # the wall',
  'membrane_plot(vb)      # a barrel over the same span',
  'dome_figure(d)         # a dome',
  '```', '',
].join('\n');

/** A metric unit in words: "6.4 m", "(m)", "kN", "kN/m²". */
const METRIC = /\bkN\b|\d m\b|\(m\)|\bm\)|kN\/m|MPa/;

describe('a calc in ft, kip, pcf and psf', () => {
  it('figureUnitsFor(3, "us") asks figures for ft, kip, kip/ft, psf and pcf at 3 significant figures', () => {
    expect(figureUnitsFor(3, 'us')).toEqual({ sigfigs: 3, units: { length: 'ft', force: 'kip', 'force per length': 'kip/ft', pressure: 'psf', 'unit weight': 'pcf' } });
    expect(figureUnitsFor(4, 'si')).toEqual({ sigfigs: 4, units: { length: 'm', force: 'kN', 'force per length': 'kN/m', pressure: 'kN/m^2', 'unit weight': 'kN/m^3' } });
  });

  it('renderSheet prints no metre or kilonewton in any of its figures, and its quantities in ft and kip to the sheet\'s 3 figures', async () => {
    const r = await renderText(US_CALC('20 ft'), { file: 'us.md' });
    const figures = parse(r.html).querySelectorAll('.vb-svg');
    expect(figures.length).toBe(5);
    for (const f of figures) expect(f.querySelectorAll('text').map((t) => t.text).join(' | ')).not.toMatch(METRIC);
    const all = figures.map((f) => f.querySelectorAll('text').map((t) => t.text).join(' | ')).join(' || ');
    expect(all).toContain('span 20 ft');
    expect(all).toContain('rise 5 ft'); // written 5 ft: not 4.99 ft from a 3-figure 1.52 m converted back
    expect(all).toContain('t = 1.25 ft');
    expect(all).toContain('T = 2 kip');
    expect(all).toMatch(/base pressure: max [\d.]+ psf/);
    expect(all).toMatch(/\d kip\/ft/);
  });

  it('renderSheet gives the kernel results in kip in the result panels (H = a.H_min)', async () => {
    const r = await renderText(US_CALC('20 ft'), { file: 'us.md' });
    const root = parse(r.html);
    const h = r.states.get('H');
    if (h?.status !== 'ok') throw new Error('H not computed');
    const kip = (h.value as { toNumber(u: string): number }).toNumber('N') / KIP;
    const shown = root.querySelector('#cell-H .vb-out')!.text;
    expect(shown).toContain(`${+kip.toPrecision(3)}\\,\\mathrm{kip}`); // as typeset (TeX source)
    const panels = root.querySelectorAll('.vb-fields .vb-num').map((n) => n.text).join(' | ');
    expect(panels).toMatch(/\d\skip/); // number, no-break space, unit
    expect(panels).not.toMatch(METRIC);
  });

  it('summarise gives kernel results in the document\'s units (kip, ft)', async () => {
    const r = await renderText(US_CALC('20 ft'), { file: 'us.md' });
    const s = summarise(r.doc, r.states, r.warnings);
    expect(s.values.H!.unit).toBe('kip');
    const fields = s.values.a!.value as Record<string, { unit: string | null; value: unknown }>;
    expect(fields.H_min!.unit).toBe('kip');
    expect(fields.t_min!.unit).toBe('ft');
    expect((fields.H_min!.value as number) * KIP).toBeCloseTo((s.values.H!.value as number) * KIP, 6);
  });

  it('vaultbook diff of two revisions shows the results in kip and ft, not kN and m', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'vb-us-diff-'));
    try {
      await writeFile(join(dir, 'old.md'), US_CALC('20 ft'));
      await writeFile(join(dir, 'new.md'), US_CALC('22 ft'));
      const out: string[] = [];
      await diffCommand([join(dir, 'old.md'), join(dir, 'new.md')], (s) => out.push(s), () => {});
      const text = out.join('\n');
      expect(text).toMatch(/a\.H_min\s+[\d.]+ kip → [\d.]+ kip/);
      expect(text).toMatch(/r\.span\s+20 ft → 22 ft/);
      expect(text).not.toMatch(/\bkN\b|\d m\b/);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });

  it('renderSheet of an SI calc keeps m and kN in its figures, to its own significant figures', async () => {
    const source = [
      '---', 'sigfigs: 3', '---',
      '```given', 'L = 6.4 m', 'f = 1.6 m', 't = 0.215 m', 'gamma = 18 kN/m^3', '```',
      '```calc', 'r = arch_ring({shape: "circular", span: L, rise: f, thickness: t, unit_weight: gamma, voussoirs: 40})', 'a = arch_limit(r)', '```',
      '```figure', 'section(r, a)', '```', '',
    ].join('\n');
    const texts = parse((await renderText(source)).html).querySelectorAll('.vb-svg text').map((t) => t.text);
    expect(texts).toContain('t = 0.215 m'); // issue 16: not 0.21 m
    expect(texts).toContain('span 6.4 m');
    expect(texts.some((t) => / ft\b|kip/.test(t))).toBe(false);
  });
});
