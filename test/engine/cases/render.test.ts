/**
 * The sheet with cases: the list of cases, the governing case in the checks summary, the envelope
 * table with a family's worst member, the plot against the swept value, a limited check in the
 * body, and `render --case NAME`. The beam: M = P·a·b/L, R_left = P·b/L (any statics text).
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, writeFileSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse, type HTMLElement } from 'node-html-parser';
import { evaluateDocument } from '../../../engine/index.js';
import { renderSheet } from '../../../engine/render/index.js';
import { renderCommand } from '../../../bin/commands/render.js';
import { checkCommand } from '../../../bin/commands/check.js';
import { fence } from '../../helpers/settle.js';

const BEAM = [
  fence('given', 'L = 6 m  # span', 'gamma_G = 1.0  # factor on the load', 'P = 10 kN  # point load', 'x_P = 3 m  # where the load stands'),
  fence('calc', 'M = gamma_G * P * x_P * (L - x_P) / L to kN m', 'R = gamma_G * P * (L - x_P) / L to kN'),
  fence('check', 'c_M = M <= 20 kN m  # bending', 'c_R = R <= 9.5 kN  # left reaction [in STR, axle]'),
  fence('cases', 'STR = {gamma_G: 1.35}  # strength', 'axle = {x_P: steps(0.1 * L, 0.9 * L, 5)}  # the load rolled across'),
].join('\n');

let root: HTMLElement;
beforeAll(async () => {
  const { doc, states, warnings, cases } = await evaluateDocument(BEAM, { file: 'beam.md' });
  root = parse(renderSheet({ doc, states, warnings, cases, options: { standalone: false } }));
});

describe('renderSheet with cases', () => {
  it('the cases block lists each case and family with the inputs it changes and why', () => {
    const rows = root.querySelectorAll('.vb-cases table.vb-cases tbody tr').map((r) => r.querySelectorAll('td').map((td) => td.text.replace(/\s+/g, ' ').trim()));
    expect(rows.map((r) => [r[0], r[2], r[3]])).toEqual([['STR', 'strength', 'line 19'], ['axle[1…5]', 'the load rolled across', 'line 20']]);
    expect(rows[1]![1]).toContain('0.6 m … 5.4 m (5 values)');
  });

  it('the checks summary names the governing case and where a limited check is judged', () => {
    const text = root.querySelector('[data-part="check-summary"]')!.text;
    // STR: M = 1.35 · 15 = 20.25 kN m > 20; axle[1]: R = 10 · 5.4 / 6 = 9 kN (0.947) beats STR's 6.75 kN.
    expect(text).toContain('governing: STR');
    expect(text).toContain('governing: axle[1] (judged in STR, axle only)');
    expect(text).not.toContain('[in STR, axle]');
  });

  it('the envelope has a column per case and a family\'s worst member; the governing entry is bold', () => {
    const table = root.querySelector('table.vb-envelope')!;
    expect(table.querySelectorAll('th').map((th) => th.text)).toEqual(['check', 'as written', 'STR', 'axle (worst)']);
    const cR = table.querySelectorAll('tbody tr').find((r) => r.text.includes('c_R'))!;
    expect(cR.querySelectorAll('td').map((td) => td.text.replace(/\s+/g, ' ').trim())).toEqual(['c_R', '—', '✓ 0.72', '✓ 0.95 axle[1]']);
    expect(cR.querySelectorAll('b').map((b) => b.text)).toEqual(['✓ 0.95']);
  });

  it('a family swept over one input gets a plot of each check\'s utilization against it', () => {
    const svg = root.querySelector('.vb-caseplot svg')!;
    expect(svg.getAttribute('aria-label')).toBe('utilization of each check against x_P in axle');
    expect(svg.querySelectorAll('path').length).toBe(2); // c_M and c_R
  });

  it('a check judged only in some cases shows its formula and its verdict over them, not the numbers as written', () => {
    const cR = root.querySelector('[data-cell="c_R"]')!;
    expect(cR.querySelector('.vb-verdict--near, .vb-verdict--pass')).not.toBeNull();
    expect(cR.text).toContain('u = 0.95');
    expect(root.text).toContain('Judged in STR, axle only; governing: axle[1]');
  });
});

describe('the cases table under --set', () => {
  it('an input set with --set shows the value every case runs with, marked as --set over the case\'s own value', async () => {
    const { doc, states, warnings, cases } = await evaluateDocument(BEAM, { file: 'beam.md', overrides: { gamma_G: '2' } });
    const sheet = parse(renderSheet({ doc, states, warnings, cases, options: { standalone: false } }));
    const rows = sheet.querySelectorAll('.vb-cases table.vb-cases tbody tr').map((r) => r.querySelectorAll('td')[1]!.text.replace(/\s+/g, ' ').trim());
    expect(rows[0]).toContain('= 2 (--set; the case gives 1.35)');
    expect(rows[0]).not.toMatch(/= 1\.35(?! ?\))/);
    // The case was computed with 2: STR gives M = 2 · 10 · 3 · 3 / 6 = 30 kN m, u = 1.5 (statics as above).
    const str = cases.checks.get('c_M')!.cases.find((x) => x.case === 'STR')!;
    expect(str.utilization).toBeCloseTo(1.5, 9);
  });

  it('a swept input pinned by --set shows the --set value and the family\'s own range, and gets no plot', async () => {
    const { doc, states, warnings, cases } = await evaluateDocument(BEAM, { file: 'beam.md', overrides: { x_P: '2 m' } });
    const sheet = parse(renderSheet({ doc, states, warnings, cases, options: { standalone: false } }));
    const axle = sheet.querySelectorAll('.vb-cases table.vb-cases tbody tr')[1]!.querySelectorAll('td')[1]!.text.replace(/\s+/g, ' ');
    expect(axle).toContain('= 2 m (--set; the case gives 0.6 m … 5.4 m)');
    expect(sheet.querySelector('.vb-caseplot')).toBeNull();
  });
});

describe('render and check on the command line', () => {
  let file = '';
  beforeAll(() => { file = join(mkdtempSync(join(tmpdir(), 'vaultbook-cases-render-')), 'beam.md'); writeFileSync(file, BEAM); });

  it('render --case axle[2] prints that case: its input marked as overridden, its own verdicts', async () => {
    const out = join(file, '..', 'axle2.html');
    expect(await renderCommand([file, '--case', 'axle[2]', '-o', out], () => {})).toBe(0);
    const sheet = parse(readFileSync(out, 'utf8'));
    expect(sheet.text).toContain('This sheet shows the case axle[2] in place of the document as written.');
    // axle[2]: x_P = 1.8 m, M = 10 · 1.8 · 4.2 / 6 = 12.6 kN m.
    expect(sheet.querySelector('[data-cell="M"]')!.text).toContain('12.6');
    expect(sheet.querySelectorAll('tr.vb-input--set').map((tr) => tr.getAttribute('id'))).toEqual(['cell-x_P']);
  });

  it('render --case STR: a check limited to axle says it has no governing case in the case shown (it said "governing: not judged in any case", though it is judged in axle)', async () => {
    const { doc, states, warnings, cases } = await evaluateDocument(BEAM.replace('# left reaction [in STR, axle]', '# left reaction [in axle]'), { file: 'beam.md', case: 'STR' });
    const sheet = parse(renderSheet({ doc, states, warnings, cases, options: { standalone: false } }));
    const note = sheet.querySelectorAll('.vb-casenote').map((p) => p.text).find((t) => t.startsWith('Judged in axle only'))!;
    expect(note).toBe('Judged in axle only; governing: none in the case shown (STR).');
    expect(note).not.toContain('not judged in any case');
  });

  it('check exits 1 when a check fails in any case, 0 when --set makes every case hold', async () => {
    expect(await checkCommand([file], () => {})).toBe(1);
    // P = 5 kN: STR gives 10.1 kN m, axle[1] gives R = 4.5 kN: all hold.
    expect(await checkCommand([file, '--set', 'P=5 kN'], () => {})).toBe(0);
  });
});
