/**
 * Verdicts everywhere: a utilization never contradicts its verdict (negative sides), the governing
 * case is claimed only when it was computed, the sheet's substituted numbers tell apart sides that
 * differ, and every output says holds / fails / not evaluated. The engineering is plain comparison
 * of two numbers (a check `d <= c` holds when d ≤ c; utilization d/c is ≤ 1 exactly when 0 ≤ d and
 * 0 < c: arithmetic, common practice for a demand/capacity ratio).
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { evaluateDocument } from '../../../engine/index.js';
import { renderSheet } from '../../../engine/render/index.js';
import { main } from '../../../bin/cli.js';
import { fence } from '../../helpers/settle.js';

let dir = '';
const write = (name: string, text: string) => { const p = join(dir, name); writeFileSync(p, text); return p; };
beforeAll(() => { dir = mkdtempSync(join(tmpdir(), 'vaultbook-verdicts-')); });

async function run(...argv: string[]) {
  const out: string[] = [];
  const err: string[] = [];
  const code = await main(argv, (s) => out.push(s), (s) => err.push(s));
  return { code, out: out.join('\n'), err: err.join('\n') };
}

async function checks(text: string) {
  return (await evaluateDocument(text, { file: 'x.md' })).summary.checks;
}

async function sheet(text: string, options: { case?: string } = {}) {
  const { doc, states, warnings, cases } = await evaluateDocument(text, { file: 'x.md', ...options });
  return renderSheet({ doc, states, warnings, cases, options: { standalone: false } });
}

/** The TeX of every typeset formula on a sheet, in order. */
function texOf(html: string): string[] {
  return [...html.matchAll(/<annotation encoding="application\/x-tex">([^<]*)</g)].map((m) => m[1]!.replace(/&gt;/g, '>').replace(/&lt;/g, '<'));
}

describe('utilization with negative sides', () => {
  it('a <= b with a = -2 kN, b = -1 kN holds and has no utilization (2.00 would say it is near its limit)', async () => {
    const [c] = await checks(`${fence('given', 'a = -2 kN', 'b = -1 kN')}\n${fence('check', 'c1 = a <= b')}`);
    expect(c).toMatchObject({ pass: true, utilization: null });
  });

  it('a <= b with a = -1 kN, b = -2 kN fails and has no utilization (0.50 would say it holds)', async () => {
    const [c] = await checks(`${fence('given', 'a = -1 kN', 'b = -2 kN')}\n${fence('check', 'c1 = a <= b')}`);
    expect(c).toMatchObject({ pass: false, utilization: null });
  });

  it('>= takes rhs/lhs only for rhs ≥ 0 and lhs > 0; a zero demand is utilization 0, a zero capacity none', async () => {
    const list = await checks(`${fence('given', 'a = 4 kN', 'b = -1 kN', 'z = 0 kN')}\n${fence('check', 'c1 = a >= 2 kN', 'c2 = a >= b', 'c3 = a <= z', 'c4 = z <= a', 'c5 = b >= -3 kN')}`);
    expect(list.map((c) => [c.name, c.pass, c.utilization])).toEqual([
      ['c1', true, 0.5], ['c2', true, null], ['c3', false, null], ['c4', true, 0], ['c5', true, null],
    ]);
  });
});

describe('the governing case', () => {
  const UP = `${fence('given', 'a = -5 kN')}\n${fence('check', 'c_up = a <= -1 kN')}\n${fence('cases', 'near = {a: -1.05 kN}', 'far = {a: -9 kN}')}`;

  it('a check holding everywhere with null utilizations claims no governing case (not "far" at 9.00)', async () => {
    const [c] = await checks(UP);
    expect(c!.pass).toBe(true);
    expect(c!.utilization).toBeNull();
    expect(c!.governing).toBeUndefined();
    expect(c!.cases!.map((x) => x.utilization)).toEqual([null, null, null]);
    const r = await run('check', write('up.md', UP));
    expect(r.out).toMatch(/c_up: a <= -1 kN  \(line \d+\)  \[holds in every case; no governing case\]/);
    expect(r.out).not.toContain('9.00');
  });

  it('a < check that fails in one case governs there, not "as written"; holding everywhere, it claims none', async () => {
    const text = `${fence('given', 'P = 5 kN')}\n${fence('check', 'c_lt = P < 20 kN', 'c_le = P <= 20 kN')}\n${fence('cases', 'small = {P: 2 kN}', 'big = {P: 25 kN}', 'huge = {P: 30 kN}')}`;
    const [lt, le] = await checks(text);
    expect(lt!.governing).toEqual({ case: 'big', pass: false, utilization: null });
    expect(le!.governing).toEqual({ case: 'huge', pass: false, utilization: 1.5 });
    const holding = await checks(text.replace('big = {P: 25 kN}', 'big = {P: 15 kN}').replace('huge = {P: 30 kN}', 'huge = {P: 19 kN}'));
    expect(holding[0]!.pass).toBe(true);
    expect(holding[0]!.governing).toBeUndefined();
    expect(holding[1]!.governing).toEqual({ case: 'huge', pass: true, utilization: 0.95 });
  });
});

describe('substituted numbers on the sheet', () => {
  const NEAR = `${fence('given', 'p = 1.0004', 'q = 0.99999')}\n${fence('check', 'c_p = p <= 1', 'c_bool = p > 1 and q < 1', 'c_far = q <= 2')}`;

  it('sides that differ print with the figures that show it: 1.0004 ≤ 1 fails, (1.0004 > 1) ∧ (0.99999 < 1) holds', async () => {
    const tex = texOf(await sheet(NEAR));
    expect(tex).toContain('\\displaystyle 1.0004 \\le 1');
    expect(tex).toContain('\\displaystyle (1.0004 > 1) \\wedge (0.99999 < 1)');
    expect(tex).not.toContain('\\displaystyle 1 \\le 1');
    // Sides far apart keep the sheet's 4 significant figures.
    expect(tex).toContain('\\displaystyle 1 \\le 2');
  });
});

describe('the three verdict words', () => {
  const ERR = `${fence('given', 'a = 3')}\n${fence('calc', 'b = 1 / (a - 1)')}\n${fence('check', 'c = b <= 5', 'd = b > 0')}`;

  it('check and eval say holds / FAILS / NOT EVALUATED', async () => {
    const file = write('words.md', `${fence('given', 'p = 1.0004')}\n${fence('check', 'c_p = p <= 1', 'c_q = p <= 2')}`);
    const c = await run('check', file);
    expect(c.out).toMatch(/!! {2}FAILS +1\.01 {2}c_p/);
    expect(c.out).toMatch(/ok {2}holds +0\.51 {2}c_q/);
    const e = await run('eval', file);
    expect(e.out).toContain('FAILS (utilization 1.01)');
    expect(e.out).toContain('holds (utilization 0.51)');
    expect(e.out).not.toMatch(/satisfied/);
    const broken = await run('check', write('broken.md', ERR.replace('a = 3', 'a = 1')));
    expect(broken.out).toMatch(/\?\? {2}NOT EVALUATED +c: b <= 5/);
    expect(broken.out).toContain('2 checks, 0 hold, 0 fail, 2 not evaluated');
    expect(broken.out).not.toMatch(/no verdict/i);
  });

  it('diff says FAILS, NOT EVALUATED and "now …" in the three words, case by case too', async () => {
    const cases = (two: string, three: string) => `${ERR}\n${fence('cases', `two = {a: ${two}}`, `three = {a: ${three}}`)}`;
    const r = await run('diff', write('old.md', cases('2', '4')), write('new.md', cases('1.1', '1')));
    expect(r.out).toContain('now FAILS');
    expect(r.out).toContain('now NOT EVALUATED');
    expect(r.out).toMatch(/holds → NOT EVALUATED|holds → FAILS/);
    expect(r.out).not.toMatch(/no verdict|no-verdict|now fail\b|now pass/);
  });

  it('check --case NOPE prints only the error, not the results as if it were a case', async () => {
    const file = write('cases.md', `${fence('given', 'P = 5 kN')}\n${fence('check', 'c_le = P <= 20 kN')}\n${fence('cases', 'big = {P: 15 kN}')}`);
    const r = await run('check', '--case', 'NOPE', file);
    expect(r.code).toBe(2);
    expect(r.out.trim().split('\n')).toEqual([expect.stringContaining('error: --case NOPE: no such case (cases: big)')]);
  });

  it('shown in one case, a check limited to another is "not judged in this case", not "not evaluated"', async () => {
    const text = `${fence('given', 'P = 5 kN')}\n${fence('check', 'c_le = P <= 20 kN', 'c_only = P <= 8 kN  # [in big]', 'c_lt = P < 20 kN')}\n${fence('cases', 'small = {P: 2 kN}', 'big = {P: 15 kN}')}`;
    const html = await sheet(text, { case: 'small' });
    const overall = /<p class="vb-overall[^"]*">(.*?)<\/p>/.exec(html)![1]!.replace(/<[^>]+>/g, '');
    expect(overall).toBe('✓ All 2 checks judged in this case hold; 1 not judged in this case.');
    expect(html).toContain('vb-sum--off');
    expect(html).not.toMatch(/not evaluated/i);
    const r = await run('check', '--case', 'small', write('limited.md', text));
    expect(r.out).toContain('--  not judged in this case');
    expect(r.out).toContain('3 checks, 2 hold, 0 fail, 1 not judged in this case;');
  });
});
