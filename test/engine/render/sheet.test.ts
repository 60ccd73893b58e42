import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { parse, type HTMLElement } from 'node-html-parser';
import { renderCellOutput, renderCheckSummary, renderDiagnostics, renderSheet } from '../../../engine/render/index.js';
import { loadKatexCss } from '../../../bin/commands/render.js';
import { renderText } from './helpers.js';

const fixture = (name: string) => readFileSync(new URL(`../../fixtures/sheets/${name}.md`, import.meta.url), 'utf8');

function byData(root: HTMLElement, attr: string, value: string): HTMLElement[] {
  return root.querySelectorAll(`[${attr}]`).filter((e) => e.getAttribute(attr) === value);
}

describe('renderSheet({doc, states})', () => {
  it('renderSheet sets backticks in descriptions as code (inputs, working, checks and the checks summary), escaped and never as markup', async () => {
    const text = ['```given', 'a_1 = 2 m  # the `a_1` length, not <b>bold</b>', '```', '```calc', 'A = a_1^2  # area from `a_1^2`', '```',
      '```check', 'c_A = A <= 5 m^2  # `A` within `A_max`', '```'].join('\n');
    const r = await renderText(text);
    const root = parse(r.html);
    const codes = (sel: string) => root.querySelectorAll(`${sel} code`).map((c) => c.text);
    expect(codes('.vb-inputs .vb-desc')).toEqual(['a_1']);
    expect(r.html).toContain('not &lt;b&gt;bold&lt;/b&gt;');
    expect(r.html).toContain('area from <code>a_1^2</code>');
    expect(codes('[data-part="check-summary"]')).toEqual(['A', 'A_max']);
    expect(r.html).not.toMatch(/`(a_1|A)`/);
  });

  it('renderSheet gives every cell one output region whose inner HTML is renderCellOutput', async () => {
    const r = await renderText(fixture('verdicts'));
    const root = parse(r.html);
    for (const cell of r.doc.graph.cells) {
      const regions = byData(root, 'data-cell', cell.id);
      expect(regions.length, cell.id).toBe(1);
      expect(regions[0]!.innerHTML).toBe(renderCellOutput(cell, r.states.get(cell.id)!, r.ctx));
    }
    for (const cell of r.doc.graph.cells.filter((c) => c.kind === 'given')) {
      expect(byData(root, 'data-input', cell.name!).length, cell.name!).toBe(1);
    }
  });

  it('renderSheet typesets the working with KaTeX and shows the substituted values', async () => {
    const r = await renderText(fixture('verdicts'));
    const region = byData(parse(r.html), 'data-cell', 'e')[0]!;
    expect(region.querySelectorAll('.katex').length).toBeGreaterThan(0);
    // One annotation per row of working (each row may break at its operators).
    const annotation = region.querySelectorAll('.vb-math annotation').map((a) => a.text).join('\n');
    expect(annotation).toContain('\\frac{{M}_{\\mathrm{Ed}}}{{N}_{\\mathrm{Ed}}}');
    expect(annotation).toContain('\\frac{21\\,\\mathrm{kN}{\\cdot}\\mathrm{m}}{180\\,\\mathrm{kN}}');
    // 21 kN·m / 180 kN = 116.7 mm at 3 significant figures (front matter sigfigs: 3).
    expect(region.querySelector('.vb-result annotation')!.text).toBe('e = 117\\,\\mathrm{mm}');
  });

  it('renderSheet marks each check pass, near the limit or fail, in words as well as classes', async () => {
    const r = await renderText(fixture('verdicts'));
    const root = parse(r.html);
    const verdicts = r.doc.graph.cells.filter((c) => c.kind === 'check').map((c) => {
      const v = byData(root, 'data-cell', c.id)[0]!.querySelector('.vb-verdict')!;
      return [v.classNames.split(' ').find((k) => k.startsWith('vb-verdict--')), v.querySelector('.vb-word')!.text];
    });
    expect(verdicts).toEqual([
      ['vb-verdict--pass', 'HOLDS'], ['vb-verdict--fail', 'FAILS'], ['vb-verdict--near', 'HOLDS'],
      ['vb-verdict--pass', 'HOLDS'], ['vb-verdict--fail', 'FAILS'], ['vb-verdict--pass', 'HOLDS'],
    ]);
    // Close to the limit is a note beside HOLDS, never a verdict word of its own (holds, fails, not evaluated).
    expect(root.querySelector('.vb-verdict--near .vb-near-note')!.text).toBe('within 5 % of the limit');
    expect(r.html).not.toMatch(/NEAR LIMIT/);
    const summary = byData(root, 'data-part', 'check-summary')[0]!;
    expect(summary.querySelectorAll('tbody tr').length).toBe(6);
    expect(summary.querySelector('.vb-overall')!.text).toContain('2 of 6 checks FAIL');
    // Each summary row links to its check.
    for (const a of summary.querySelectorAll('a')) expect(root.getElementById(a.getAttribute('href')!.slice(1))).not.toBeNull();
    expect(summary.innerHTML).toBe(renderCheckSummary(r.doc, r.states));
  });

  it('renderSheet says prominently on its first page that a sheet has errors, and shows each in place', async () => {
    const r = await renderText(fixture('errors'));
    const root = parse(r.html);
    const status = byData(root, 'data-part', 'status')[0]!;
    expect(status.text).toContain('THIS SHEET HAS 3 ERRORS');
    expect(status.text).toContain('not computed');
    const list = byData(root, 'data-part', 'diagnostics')[0]!;
    expect(list.querySelectorAll('li').length).toBe(4); // three errors and the range warning
    expect(list.innerHTML).toBe(renderDiagnostics(r.doc, r.states, r.warnings));
    expect(byData(root, 'data-cell', 'bad')[0]!.text).toContain('cannot add length (m) to force (kN)');
    expect(byData(root, 'data-cell', 'later')[0]!.text).toContain('not computed: it needs bad');
    expect(byData(root, 'data-cell', 'L')[0]!.text).toContain('outside the allowed range');
    // The unreadable line is not a cell: it is shown in its block with its source text.
    const stray = root.querySelectorAll('.vb-step--stray');
    expect(stray.length).toBe(1);
    expect(stray[0]!.querySelector('.vb-source')!.text).toBe('half = (L / 2             # unclosed bracket');
    // The summary counts a check that could not be evaluated as such, never as holding.
    expect(byData(root, 'data-part', 'check-summary')[0]!.text).toContain('1 of 2 not evaluated');
  });

  it('renderSheet marks inputs overridden with --set and names them on the first page', async () => {
    const r = await renderText(fixture('verdicts'), { overrides: { N_Ed: '150 kN' } });
    const root = parse(r.html);
    const cell = byData(root, 'data-cell', 'N_Ed')[0]!;
    expect(cell.querySelector('.vb-set')!.text).toContain('set');
    expect(cell.querySelector('.vb-was')!.text).toBe('document: 180 kN');
    expect(byData(root, 'data-part', 'status')[0]!.text).toContain('N_Ed = 150 kN (document: 180 kN)');
  });

  it('renderSheet shows the fields of a kernel result that the document reads', async () => {
    const r = await renderText(fixture('arch-ring'));
    const table = byData(parse(r.html), 'data-cell', 'a')[0]!.querySelector('.vb-fields')!;
    const fields = table.querySelectorAll('annotation').map((a) => a.text);
    expect(fields).toEqual(['a{.}{H}_{\\min}', 'a{.}\\mathrm{gsf}']);
  });

  it('renderSheet never embeds a string value as markup, even one that looks like a figure', async () => {
    const src = '```calc\nx = "<svg onload=alert(1)><script>alert(2)</script></svg>"  # a string\n```\n\n```figure\n"<svg onload=alert(3)></svg>"  # not a figure\n```\n';
    const r = await renderText(src);
    expect(r.html).not.toContain('<svg onload');
    expect(r.html).not.toContain('<script');
    expect(r.html).toContain('NOT A FIGURE');
    expect(r.html).toContain('&lt;svg onload=alert(3)&gt;');
  });

  it('renderSheet embeds the SVG a figure function drew', async () => {
    const r = await renderText(fixture('arch-ring'));
    const figures = parse(r.html).querySelectorAll('.vb-figure .vb-svg > svg');
    expect(figures.length).toBe(2);
  });

  it('renderSheet is byte-identical for the same input, standalone with fonts inlined', async () => {
    const src = fixture('arch-ring');
    const archive = { hash: createHash('sha256').update(src).digest('hex'), commit: 'abc123', dirty: false };
    const options = { standalone: true, katexCss: loadKatexCss(), archive };
    const a = await renderText(src, { options });
    const b = await renderText(src, { options });
    expect(a.html).toBe(b.html);
    expect(a.html.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(a.html).toContain('Content-Security-Policy');
    expect(a.html).toContain('url(data:font/woff2;base64,');
    expect(a.html).not.toMatch(/url\((?!data:)/);
    expect(a.html).not.toMatch(/\b(src|href)="(?!#|data:)/);
  });

  it('renderSheet carries the source hash, and the commit when given', async () => {
    const src = fixture('verdicts');
    const plain = await renderText(src);
    expect(parse(plain.html).querySelector('.vb-hash')!.text).toBe(createHash('sha256').update(src).digest('hex'));
    const dirty = await renderText(src, { options: { archive: { hash: 'h', commit: '0123456789abcdef', dirty: true } } });
    expect(parse(dirty.html).querySelector('.vb-archive')!.text).toContain('commit 0123456789ab with uncommitted changes');
  });

  it('renderSheet refuses a states argument that is not a Map', async () => {
    const r = await renderText(fixture('verdicts'));
    expect(() => renderSheet({ doc: r.doc, states: {} as never })).toThrow(TypeError);
  });
});
