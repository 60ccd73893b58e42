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

  it('a gatehouse bay in ft, pcf, psf and ksi (cross_vault, dome_limit, buttress, tie) agrees with the same calc in SI to 1e-10, and its figures say no m or kN', async () => {
    // The SI calc is the US one converted by hand: NIST SP 811, 1 ft = 0.3048 m, 1 lbf = 4.4482216152605 N, 1 in = 0.0254 m.
    // Before kip was redefined as 1000 lbf, every kip result sat 3.4e-9 off; before the semicircular webs kept stilt 0, the
    // 16 ft bay's elevations were headed "(stilted)".
    const calc = (g: Record<string, string>) => [
      '---', 'title: Gatehouse bay (fictional)', '---', '',
      '```given', ...Object.entries(g).map(([k, v]) => `${k} = ${v}`), '```', '',
      '```calc',
      'cv = cross_vault({span_x: L_x, shape: "semicircular", thickness: t_w, unit_weight: w_m, live: q_l})',
      'H_c = cv.H_x_min', 'z_c = cv.z_x_min', 'a_c = cv.a_x_min', 'V_c = cv.V_corner',
      'd = dome({radius: R_d, half_angle: 90 deg, thickness: t_d, unit_weight: w_m})',
      'H_d = dome_limit(d).H_min',
      'bt = buttress({height: h_b, width: b_b, depth: d_b, unit_weight: w_m, T: H_c, z_T: h_b, V: V_c})',
      'p_b = bt.sigma_max',
      'N_t = tie({T: H_c, f_y: f_y, f_u: f_u, diameter: d_t}).N_thread_Rd',
      '```', '', '```figure', 'cross_vault_figure(cv)', 'support_figure(bt)', '```', '',
    ].join('\n');
    const ft = 0.3048, lbf = 4.4482216152605, inch = 0.0254;
    const us = calc({ L_x: '16 ft', t_w: '0.75 ft', w_m: '120 pcf', q_l: '40 psf', R_d: '12 ft', t_d: '1.25 ft', h_b: '14 ft', b_b: '6 ft', d_b: '3 ft', f_y: '36 ksi', f_u: '58 ksi', d_t: '1.5 in' });
    const si = calc({
      L_x: `${16 * ft} m`, t_w: `${0.75 * ft} m`, w_m: `${120 * lbf / ft ** 3} N/m^3`, q_l: `${40 * lbf / ft ** 2} Pa`, R_d: `${12 * ft} m`, t_d: `${1.25 * ft} m`,
      h_b: `${14 * ft} m`, b_b: `${6 * ft} m`, d_b: `${3 * ft} m`, f_y: `${36e3 * lbf / inch ** 2} Pa`, f_u: `${58e3 * lbf / inch ** 2} Pa`, d_t: `${1.5 * inch} m`,
    });
    const a = await renderText(us, { file: 'us.md' }), b = await renderText(si, { file: 'si.md' });
    const sa = summarise(a.doc, a.states, a.warnings).values, sb = summarise(b.doc, b.states, b.warnings).values;
    const toSI: Record<string, number> = { ft, kip: 1000 * lbf, 'kip/ft': 1000 * lbf / ft, psf: lbf / ft ** 2, m: 1, kN: 1e3, 'kN/m': 1e3, 'kN/m^2': 1e3 };
    for (const name of ['H_c', 'z_c', 'a_c', 'V_c', 'H_d', 'p_b', 'N_t']) {
      const x = sa[name]!, y = sb[name]!;
      expect(x.unit, name).toMatch(/^(ft|kip|kip\/ft|psf)$/);
      const rel = ((x.value as number) * toSI[x.unit!]!) / ((y.value as number) * toSI[y.unit!]!) - 1;
      expect(Math.abs(rel), `${name}: ${x.text} against ${y.text}`).toBeLessThan(1e-10);
    }
    const figures = parse(a.html).querySelectorAll('.vb-svg').map((f) => f.querySelectorAll('text').map((t) => t.text).join(' '));
    expect(figures.length).toBe(2);
    for (const f of figures) expect(f).not.toMatch(METRIC);
    expect(figures[0]).toMatch(/across the x-span \(semicircular\)/);
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
