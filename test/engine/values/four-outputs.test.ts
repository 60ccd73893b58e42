/**
 * One number formatter: the command line, the JSON `text`, the printed sheet and the live page
 * show the same digits for the same value. One fictional document goes through all four; every
 * named value and every check's utilization is read back from each output and compared.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse as parseHtml, type HTMLElement } from 'node-html-parser';
import { main } from '../../../bin/cli.js';
import { compile, startSession } from '../../../engine/index.js';
import { makeRenderContext, renderCellOutput, renderCheckSummary } from '../../../engine/render/index.js';
import { formatUtilization } from '../../../engine/values/format.js';
import { compareToDocument, changeBadge } from '../../../site/review.js';

// Utilizations chosen where the outputs used to disagree: 1.0043 printed "FAILS 1" on the command line,
// 1.435 printed 1.43 there and 1.44 on the sheet, 1.0143 printed 1.01 there and 1.02 on the page.
const DOC = ['---', 'title: Formatting probe (fictional)', 'sigfigs: 4', '---', '',
  '```given',
  'N_Ed = 100.43 kN     # axial demand',
  'N_Rd = 100 kN        # axial resistance',
  'M_Ed = 14.35 kN m    # moment demand',
  'M_Rd = 10 kN m       # moment resistance',
  'w = 10.143 kN/m      # line load',
  'F_hand = 17093 N     # a force written in newtons by hand',
  'L = 6.4 m            # span',
  'k = 0.000012345      # a small plain number',
  'P = 1234567 N        # a large force',
  'phi = 0.5236 rad     # an angle in radians',
  'gamma = 18 kN/m^3    # brick masonry (fictional value)',
  't = 0.3 m            # ring thickness',
  '```', '',
  '```calc',
  'V = w * L / 2                      # end reaction',
  'M = w * L^2 / 8 to kN m            # mid-span moment',
  'ratio = N_Ed / N_Rd                # a plain ratio',
  'sigma = F_hand / (0.2 m * 0.3 m)   # a stress',
  'r = arch_ring({shape: "circular", span: L, rise: 1.6 m, thickness: t, unit_weight: gamma})',
  'a = arch_limit(r)',
  'H = a.H_min                        # least thrust',
  'gsf = a.gsf',
  '```', '',
  '```check',
  'c_N = N_Ed <= N_Rd        # fails by 0.43 %',
  'c_M = M_Ed <= M_Rd        # fails by 43.5 %',
  'c_w = w <= 10 kN/m        # fails by 1.43 %',
  'c_V = V <= 40 kN          # holds',
  'c_g = a.gsf >= 2          # holds',
  'c_exact = N_Rd <= 100 kN  # exactly at the limit: holds',
  '```', ''].join('\n');

/** A value as text reduced to what must agree: its numbers (digits, sign, power of ten) and its unit's letters. */
function canonical(text: string): string {
  const t = text
    .replace(/\\mathrm\{([^}]*)\}/g, '$1').replace(/\{\}\^\{\\circ\}/g, 'deg').replace(/°/g, 'deg')
    .replace(/\\times\s*10\^\{(-?\d+)\}/g, 'e$1').replace(/\s*×\s*10<sup>([−-]?\d+)<\/sup>/g, 'e$1')
    .replace(/<[^>]+>/g, '').replace(/&nbsp;/g, ' ').replace(/−/g, '-')
    .replace(/(\d)(?:\\,|\u202f| )(?=\d{3})/g, '$1');
  const numbers = t.match(/-?\d+(?:\.\d+)?(?:e-?\d+)?/g) ?? [];
  const unit = t.replace(/-?\d+(?:\.\d+)?(?:e-?\d+)?/g, '').replace(/\\cdot|\\,|[^A-Za-z]/g, '');
  return `${numbers.join(' ')} ${unit}`.trim();
}

/** The TeX source KaTeX keeps beside what it draws, right of the last "=". */
function texResult(el: HTMLElement): string | null {
  const notes = el.querySelectorAll('annotation');
  if (notes.length === 0) return null;
  const tex = notes[notes.length - 1]!.text.replace(/&amp;/g, '&');
  return tex.slice(tex.lastIndexOf("=") + 1).replace(/\\end\{aligned\}$/, "").trim();
}

/** What the sheet or page shows as one cell's value. */
function shownValue(el: HTMLElement): string {
  const input = el.querySelector('.vb-value');
  if (input) return input.innerHTML;
  const result = el.querySelector('.vb-result');
  if (!result) throw new Error('no value shown');
  return texResult(result) ?? result.innerHTML;
}

/** The utilization a check shows: its badge, and the last row of its working. */
function shownUtilizations(el: HTMLElement): string[] {
  const badge = el.querySelector('.vb-util')!.text.replace(/^u = /, '');
  const working = texResult(el.querySelector('.vb-math')!)!;
  return [badge, working.trim()];
}

interface Outputs {
  cli: Map<string, string>;
  cliChecks: Map<string, string>;
  json: Record<string, { text: string; value: unknown }>;
  sheet: HTMLElement;
  page: Map<string, HTMLElement>;
  pageSummary: HTMLElement;
}

let out: Outputs;

beforeAll(async () => {
  const dir = mkdtempSync(join(tmpdir(), 'vaultbook-four-'));
  const file = join(dir, 'probe.md');
  writeFileSync(file, DOC);
  const lines: string[] = [];
  await main(['eval', file], (s) => lines.push(s), () => {});
  const cli = new Map<string, string>();
  for (const row of lines.join('\n').split('\n').slice(2)) {
    const [, , name, value] = row.split(/\s{2,}/);
    if (name && value) cli.set(name, value);
  }
  const checkLines: string[] = [];
  await main(['check', file], (s) => checkLines.push(s), () => {});
  const cliChecks = new Map<string, string>();
  for (const l of checkLines.join('\n').split('\n')) {
    const m = /^\s+(?:ok {2}holds|!! {2}FAILS)\s+(\S+)\s+(\w+):/.exec(l);
    if (m) cliChecks.set(m[2]!, m[1]!);
  }
  const json: string[] = [];
  await main(['eval', file, '--json'], (s) => json.push(s), () => {});
  const sheetPath = join(dir, 'probe.html');
  await main(['render', file, '-o', sheetPath], () => {}, () => {});
  // The live page: the sheet rendered once without its page wrapper, then each cell patched by renderCellOutput.
  const doc = compile(DOC, { file: 'probe.md' });
  const session = startSession(doc);
  const states = await session.settle();
  const ctx = makeRenderContext(doc, states, session.warnings, { standalone: false });
  const page = new Map<string, HTMLElement>();
  for (const cell of doc.graph.cells) page.set(cell.id, parseHtml(renderCellOutput(cell, states.get(cell.id)!, ctx)));
  session.dispose();
  out = { cli, cliChecks, json: JSON.parse(json.join('\n')).values, sheet: parseHtml(readFileSync(sheetPath, 'utf8')), page, pageSummary: parseHtml(renderCheckSummary(doc, states, ctx)) };
});

const VALUES = ['N_Ed', 'M_Ed', 'w', 'F_hand', 'L', 'k', 'P', 'phi', 'V', 'M', 'ratio', 'sigma', 'H', 'gsf'];

describe('the same value reads the same in all four outputs', () => {
  it.each(VALUES)('%s: command line, JSON text, printed sheet and live page agree', (name) => {
    const sheet = out.sheet.querySelector(`[data-cell="${name}"]`)!;
    const shown = {
      cli: canonical(out.cli.get(name)!),
      json: canonical(out.json[name]!.text),
      sheet: canonical(shownValue(sheet)),
      page: canonical(shownValue(out.page.get(name)!)),
    };
    expect(shown.cli).not.toBe('');
    expect(shown).toEqual({ cli: shown.cli, json: shown.cli, sheet: shown.cli, page: shown.cli });
  });

  it('the kernel fields the sheet lists read as the JSON record gives them', () => {
    const rows = out.sheet.querySelector('[data-cell="a"]')!.querySelectorAll('table.vb-fields tr');
    expect(rows.length).toBeGreaterThan(0);
    const record = out.json.a!.value as Record<string, { text: string }>;
    for (const row of rows) {
      const field = /\.\s*(?:\\mathrm\{)?([A-Za-z_\\{}]+)/.exec(texResult(row.querySelector('.vb-sym')!) ?? '')?.[1] ?? '';
      const name = field.includes('gsf') ? 'gsf' : 'H_min';
      expect(canonical(row.querySelector('.vb-num')!.innerHTML)).toBe(canonical(record[name]!.text));
    }
  });
});

// Expected texts: the utilization rounded UP to two decimals (common practice), e.g. 100.43/100 = 1.0043 → 1.01.
const CHECKS: Array<[string, string]> = [
  ['c_N', '1.01'], ['c_M', '1.44'], ['c_w', '1.02'], ['c_V', formatUtilization((10.143 * 6.4) / 2 / 40)], ['c_exact', '1.00'],
];

describe('a utilization prints the same everywhere, rounded up', () => {
  it.each(CHECKS)('%s prints %s on the command line, in JSON, on the sheet and on the page', (name, expected) => {
    const sheet = out.sheet.querySelector(`[data-cell="${name}"]`)!;
    const summaryRow = (root: HTMLElement) => root.querySelectorAll('tr.vb-sum').find((r) => r.querySelector('a')?.getAttribute('href') === `#${sheet.parentNode!.parentNode!.getAttribute('id')}`);
    const shown = [
      out.cliChecks.get(name),
      /utilization (\S+)\)/.exec(out.json[name]!.text)?.[1],
      ...shownUtilizations(sheet),
      ...shownUtilizations(out.page.get(name)!),
      summaryRow(out.sheet)?.querySelector('td.vb-num')?.text,
      summaryRow(out.pageSummary)?.querySelector('td.vb-num')?.text,
    ];
    expect(shown).toEqual(Array(shown.length).fill(expected));
  });

  it('the gsf check (capacity over demand) agrees too', () => {
    const cli = out.cliChecks.get('c_g')!;
    expect(/utilization (\S+)\)/.exec(out.json.c_g!.text)?.[1]).toBe(cli);
    expect(shownUtilizations(out.sheet.querySelector('[data-cell="c_g"]')!)).toEqual([cli, cli]);
  });
});

describe('the live page\'s review badge', () => {
  it('a check brought within its limit shows both utilizations as the sheet prints them', async () => {
    // The reviewer lowers N_Ed from the document's 100.43 kN (1.0043, fails) to 99 kN (0.99, holds).
    const doc = compile(DOC, { file: 'probe.md' });
    const session = startSession(doc);
    const documentStates = new Map(await session.settle());
    session.setInput('N_Ed', '99 kN');
    const reviewed = new Map(await session.settle());
    session.dispose();
    const cell = doc.graph.byId.get('c_N')!;
    const badge = changeBadge(compareToDocument(cell, documentStates.get('c_N'), reviewed.get('c_N'), 4));
    expect(badge).toContain('(utilization 1.01 → 0.99)');
  });
});

describe('formatUtilization(u, pass)', () => {
  // Rounded up to 0.01 (common practice: a printed 1.00 never hides a ratio above one).
  it.each([
    [1.0043, undefined, '1.01'], [1.435, undefined, '1.44'], [1.0143, undefined, '1.02'],
    [0.9501, undefined, '0.96'], [0.95, undefined, '0.95'], [0.07, undefined, '0.07'], [1, true, '1.00'],
  ])('formatUtilization(%s, %s) is %s', (u, pass, expected) => {
    expect(formatUtilization(u, pass)).toBe(expected);
  });

  it('a check that fails by round-off never prints 1.00 or less', () => {
    expect(formatUtilization(1 + 1e-12, false)).toBe('1.01');
  });

  it('a check that holds within the comparison tolerance never prints above 1.00', () => {
    expect(formatUtilization(1 + 1e-13, true)).toBe('1.00');
  });

  it('an unbounded utilization prints ∞', () => {
    expect(formatUtilization(Infinity, false)).toBe('∞');
  });
});
