/**
 * judgeCases and evaluateDocument with cases: the governing case, families and pairs, --case,
 * the JSON contract, the evaluation count, and worker threads giving the single-thread results.
 * The beam: simply supported, one point load P at x_P: M = P·a·b/L, R_left = P·b/L (any statics
 * text, e.g. Gere & Timoshenko, Mechanics of Materials, App. G); the numbers below are worked by hand.
 */
import { describe, it, expect } from 'vitest';
import { compile, evaluateDocument, startSession } from '../../../engine/index.js';
import { downstreamOf, errorKeys, expandCases, governingOf, runCases, exactText, steps } from '../../../engine/cases/index.js';
import { casePool } from '../../../bin/archive/cases.js';
import { main } from '../../../bin/cli.js';
import { fence } from '../../helpers/settle.js';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseExpression } from '../../../cells/math.js';

const BEAM = [
  fence('given', 'L = 6 m  # span', 'gamma_G = 1.0  # factor on the load', 'P = 10 kN  # point load', 'x_P = 3 m  # where the load stands', 'w = 0 kN/m  # line load'),
  fence('calc', 'M = gamma_G * P * x_P * (L - x_P) / L + w * L^2 / 8 to kN m', 'R = gamma_G * P * (L - x_P) / L to kN', 'V = w * L / 2 to kN'),
  fence('check', 'c_M = M <= 20 kN m  # bending', 'c_R = R <= 9 kN  # left reaction [in STR, axle]', 'c_V = V <= 1 kN  # shear from the line load'),
  fence('cases', 'EQU = {gamma_G: 1.1}  # overturning', 'STR = {gamma_G: 1.35}  # strength', 'axle = {x_P: steps(0.1 * L, 0.9 * L, 5)}  # the load rolled across'),
].join('\n');

describe('governingOf', () => {
  it('governingOf picks the failing case of highest utilization over a higher passing one as written', () => {
    expect(governingOf([{ case: null, pass: true, utilization: 0.9 }, { case: 'A', pass: false, utilization: 1.02 }, { case: 'B', pass: false, utilization: 1.3 }]))
      .toEqual({ case: 'B', pass: false, utilization: 1.3 });
  });
  it('governingOf prefers a failing plain true/false check (no utilization) to any passing one', () => {
    expect(governingOf([{ case: null, pass: true, utilization: null }, { case: 'A', pass: false, utilization: null }])?.case).toBe('A');
  });
  it('governingOf gives the first case without a verdict when none fails', () => {
    expect(governingOf([{ case: null, pass: true, utilization: 0.5 }, { case: 'A', pass: null, utilization: null }, { case: 'B', pass: true, utilization: 0.9 }])?.case).toBe('A');
  });
  it('governingOf keeps the document as written on a tie', () => {
    expect(governingOf([{ case: null, pass: true, utilization: 0.5 }, { case: 'A', pass: true, utilization: 0.5 }])?.case).toBe(null);
  });
});

describe('steps and exactText', () => {
  it('steps(a, b, n) gives n values from a to b inclusive, keeping units', () => {
    const v = steps(parseExpression('1 m').compile().evaluate(), parseExpression('2 m').compile().evaluate(), 3) as Array<{ toNumber(u: string): number }>;
    expect(v.map((x) => x.toNumber('mm'))).toEqual([1000, 1500, 2000]);
  });
  it('exactText(value) parses back to exactly the same value, units included', () => {
    for (const text of ['0.05 * 6.4 m', '1.1 * 18 kN/m^3', '0.1 + 0.2', '3 kN m / 7']) {
      const v = parseExpression(text).compile().evaluate() as { value?: number };
      const back = parseExpression(exactText(v)!).compile().evaluate() as { value?: number };
      expect(typeof v === 'number' ? back : back.value).toBe(typeof v === 'number' ? v : v.value);
    }
  });
});

describe('evaluateDocument with cases', () => {
  it('every check is judged as written and in every case; the verdict is the worst and names the governing case', async () => {
    const { summary } = await evaluateDocument(BEAM, { file: 'beam.md' });
    const c_M = summary.checks[0]!;
    // STR: M = 1.35 · 10 kN · 3 m · 3 m / 6 m = 20.25 kN m > 20 kN m: u = 1.0125, fails.
    expect(c_M.governing).toEqual({ case: 'STR', pass: false, utilization: expect.closeTo(1.0125, 12) });
    expect([c_M.pass, c_M.utilization]).toEqual([false, expect.closeTo(1.0125, 12)]);
    // As written 15 kN m (0.75), EQU 16.5 (0.825), axle at 0.6 m: 10·0.6·5.4/6 = 5.4 kN m (0.27).
    expect(c_M.cases!.map((x) => [x.case, Number(x.utilization!.toFixed(6))])).toEqual([
      [null, 0.75], ['EQU', 0.825], ['STR', 1.0125], ['axle[1]', 0.27], ['axle[2]', 0.63], ['axle[3]', 0.75], ['axle[4]', 0.63], ['axle[5]', 0.27],
    ]);
  });

  it('a check limited with [in STR, axle] is judged only in those cases; its governing case is the load nearest the support', async () => {
    const { summary } = await evaluateDocument(BEAM, { file: 'beam.md' });
    const c_R = summary.checks[1]!;
    expect(c_R.cases!.map((x) => x.case)).toEqual(['STR', 'axle[1]', 'axle[2]', 'axle[3]', 'axle[4]', 'axle[5]']);
    // axle[1]: R = 10 kN · 5.4 / 6 = 9 kN = capacity: u = 1, holds.
    expect(c_R.governing).toEqual({ case: 'axle[1]', pass: true, utilization: expect.closeTo(1, 12) });
  });

  it('the JSON keeps every field and adds top-level cases and per-check governing and cases', async () => {
    const { summary } = await evaluateDocument(BEAM, { file: 'beam.md' });
    const json = JSON.parse(JSON.stringify(summary));
    expect(Object.keys(json)).toEqual(['file', 'meta', 'values', 'checks', 'diagnostics', 'cases']);
    expect(Object.keys(json.checks[0])).toEqual(['name', 'source', 'description', 'line', 'pass', 'utilization', 'governing', 'cases']);
    expect(json.cases[0]).toEqual({ name: 'EQU', family: null, index: null, overrides: { gamma_G: '1.1' }, description: 'overturning', line: 22 });
    expect(json.cases[4]).toEqual({ name: 'axle[3]', family: 'axle', index: 3, overrides: { x_P: exactText(parseExpression('0.1 * 6 m + (0.9 * 6 m - 0.1 * 6 m) * 0.5').compile().evaluate()) }, description: 'the load rolled across', line: 24 });
    expect(json.values.gamma_G.value).toBe(1);
  });

  it('two lists on one line give every pair, named in order with the last list running fastest', async () => {
    const text = BEAM.replace('axle = {x_P: steps(0.1 * L, 0.9 * L, 5)}', 'grid = {x_P: [1 m, 2 m], P: [5 kN, 10 kN, 20 kN]}').replace('[in STR, axle]', '[in STR, grid]');
    const { summary } = await evaluateDocument(text, { file: 'beam.md' });
    expect(summary.cases!.filter((c) => c.family === 'grid').map((c) => [c.name, c.overrides.x_P, c.overrides.P])).toEqual([
      ['grid[1]', '1 m', '5 kN'], ['grid[2]', '1 m', '10 kN'], ['grid[3]', '1 m', '20 kN'],
      ['grid[4]', '2 m', '5 kN'], ['grid[5]', '2 m', '10 kN'], ['grid[6]', '2 m', '20 kN'],
    ]);
    // grid[3]: R = 20 kN · 5 m / 6 m = 16.67 kN > 9 kN.
    expect(summary.checks[1]!.governing).toEqual({ case: 'grid[3]', pass: false, utilization: expect.closeTo(20 * 5 / 6 / 9, 12) });
  });

  it('--set applies on top of every case: an input set stays set, and case values use the set document', async () => {
    const { summary } = await evaluateDocument(BEAM, { file: 'beam.md', overrides: { gamma_G: '1.2', L: '5 m' } });
    expect(summary.cases!.find((c) => c.name === 'EQU')!.overrides).toEqual({});
    // axle[5] stands at 0.9 L of the set span, 4.5 m.
    expect(summary.cases!.find((c) => c.name === 'axle[5]')!.overrides).toEqual({ x_P: '4.5 m' });
    // Every case has γ_G = 1.2 and L = 5 m: the worst moment is at mid-span, 1.2 · 10 · 2.5 · 2.5 / 5 = 15 kN m.
    expect(summary.checks[0]!.utilization).toBeCloseTo(0.75, 12);
  });

  it('a case that makes a cell fail reports the error once for its family, on the cell\'s line', async () => {
    const text = BEAM.replace('M = gamma_G', 'M = sqrt(x_P - 1 m) * 1 kN m^0.5 + gamma_G').replace('c_M = M <= 20 kN m', 'c_M = M <= 40 kN m');
    const { summary } = await evaluateDocument(text, { file: 'beam.md' });
    const errors = summary.diagnostics.filter((d) => d.severity === 'error');
    // Only axle[1] (x_P = 0.6 m) puts a negative number under the root: M (line 10) would be complex,
    // which is refused on M's own line; c_M then has no verdict.
    expect(errors.map((d) => [d.message.slice(0, 17), d.line, d.cellId])).toEqual([['in case axle[1]: ', 10, 'M']]);
    expect(summary.checks[0]!.pass).toBe(null);
  });
});

describe('warnings in cases', () => {
  it('a case that puts an input outside its range warns once for its family, on the case line', async () => {
    const text = BEAM.replace('x_P = 3 m  # where the load stands', 'x_P = 3 m  # where the load stands [1 m, 5 m]');
    const { summary } = await evaluateDocument(text, { file: 'beam.md' });
    // axle[1] at 0.6 m and axle[5] at 5.4 m lie outside [1 m, 5 m]; the axle line is line 24 (x_P itself is on line 5).
    expect(summary.diagnostics.map((d) => [d.severity, d.line, d.message])).toEqual([['warning', 24, 'axle: x_P = 0.6 m is outside the allowed range [1 m, 5 m] (and 1 more of the 5 values)']]);
  });
});

describe('--case NAME', () => {
  it('evaluateDocument({case}) equals the document with the case\'s overrides set, and judges only that case', async () => {
    const one = await evaluateDocument(BEAM, { file: 'beam.md', case: 'axle[2]' });
    const overrides = one.summary.cases![0]!.overrides;
    const set = await evaluateDocument(BEAM, { file: 'beam.md', overrides });
    expect(one.summary.values).toEqual(set.summary.values);
    expect(one.summary.checks.map((c) => c.cases!.map((x) => x.case))).toEqual([['axle[2]'], ['axle[2]'], ['axle[2]']]);
  });

  it('check --case with an unknown name exits 2 and suggests the nearest case', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'vaultbook-cases-'));
    const file = join(dir, 'beam.md');
    writeFileSync(file, BEAM);
    const out: string[] = [];
    expect(await main(['check', file, '--case', 'axel[2]'], (s) => out.push(s), () => {})).toBe(2);
    expect(out.join('\n')).toContain('--case axel[2]: no such case; did you mean "axle[2]"?');
    const ok: string[] = [];
    expect(await main(['check', file, '--case', 'EQU'], (s) => ok.push(s), () => {})).toBe(0);
    expect(ok[0]).toBe('case EQU, as if its inputs were written in:');
    const all: string[] = [];
    expect(await main(['check', file], (s) => all.push(s), () => {})).toBe(1);
    expect(all.find((l) => l.includes('c_M:'))).toContain('[governing: STR]');
  });
});

describe('a check limited by [in …] on the command line', () => {
  it('check prints the limit in words, never the raw [in …] marker; the JSON description leaves it out and judged_in names it', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'vaultbook-limit-'));
    const file = join(dir, 'beam.md');
    writeFileSync(file, BEAM);
    const all: string[] = [];
    await main(['check', file], (s) => all.push(s), () => {});
    const line = all.find((l) => l.includes('c_R:'))!;
    expect(line).not.toContain('[in ');
    expect(line).toContain('— left reaction  [governing: ');
    expect(line).toContain('(judged in STR, axle only)]');
    // Shown in one case it is not judged in, the line still says where it is judged.
    const one: string[] = [];
    await main(['check', file, '--case', 'EQU'], (s) => one.push(s), () => {});
    expect(one.find((l) => l.includes('c_R:'))).toMatch(/not judged in this case .*— left reaction {2}\[judged in STR, axle only\]$/);
    const json: string[] = [];
    await main(['check', file, '--json'], (s) => json.push(s), () => {});
    const c = JSON.parse(json.join('\n')).checks.find((x: { name: string }) => x.name === 'c_R');
    expect([c.description, c.judged_in]).toEqual(['left reaction', ['STR', 'axle']]);
    // A check without a marker has no judged_in.
    expect(JSON.parse(json.join('\n')).checks.find((x: { name: string }) => x.name === 'c_M')).not.toHaveProperty('judged_in');
  });
});

describe('check --case --json on a check limited to other cases', () => {
  it('gives it no governing case (it printed governing {case: null, …}, which README reads as "the document as written governs"), cases [] and its judged_in', async () => {
    const one = await evaluateDocument(BEAM, { file: 'beam.md', case: 'EQU' });
    const c = one.summary.checks.find((x) => x.name === 'c_R')!;
    expect(c).not.toHaveProperty('governing');
    expect(c).toMatchObject({ pass: null, utilization: null, cases: [], judged_in: ['STR', 'axle'] });
    // A check judged in EQU keeps its governing case.
    expect(one.summary.checks.find((x) => x.name === 'c_M')!.governing).toMatchObject({ case: 'EQU', pass: true });
  });
});

describe('eval on a check limited to cases', () => {
  it('eval says a check limited to STR and axle is not judged as written, nor with --case EQU (it printed "holds (utilization 0.56)" and, in EQU, its verdict there)', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'vaultbook-eval-limit-'));
    const file = join(dir, 'beam.md');
    writeFileSync(file, BEAM);
    const row = async (...args: string[]) => {
      const out: string[] = [];
      await main(['eval', file, ...args], (s) => out.push(s), () => {});
      return out.join('\n').split('\n').find((l) => /\bc_R\b/.test(l))!;
    };
    expect(await row()).toMatch(/check\s+c_R\s+not judged as written \(judged in STR, axle only\)$/);
    expect(await row('--case', 'EQU')).toMatch(/check\s+c_R\s+not judged in this case \(judged in STR, axle only\)$/);
    // In a case it is judged in, its verdict there: R = 1.35 · 10 kN · 3/6 = 6.75 kN ≤ 9 kN, u = 0.75 (statics by hand).
    expect(await row('--case', 'STR')).toMatch(/check\s+c_R\s+holds \(utilization 0\.75\)$/);
    // A check without a limit keeps its verdict.
    const out: string[] = [];
    await main(['eval', file], (s) => out.push(s), () => {});
    expect(out.join('\n')).toMatch(/check\s+c_M\s+holds \(utilization 0\.75\)/); // M = 10 kN · 3 · 3 / 6 = 15 kN m of 20
  });
});

describe('--set of another dimension (the rule the live page applies to an edit)', () => {
  it('--set refuses a value whose dimension is not the input\'s, naming both, on the input\'s line; check exits 2', async () => {
    const problems = (overrides: Record<string, string>) => compile(BEAM, { file: 'beam.md', overrides }).diagnostics.map((d) => `${d.line}:${d.column} ${d.severity} ${d.ruleId} ${d.message}`);
    expect(problems({ P: '5 m' })).toEqual(['4:1 error units/mismatch --set P: P is force (kN); "5 m" is length (m)']);
    expect(problems({ gamma_G: '2 kN' })).toEqual(['3:1 error units/mismatch --set gamma_G: gamma_G is a plain number; "2 kN" is force (kN)']);
    expect(problems({ L: '7' })).toEqual(['2:1 error units/mismatch --set L: "7" has no unit, and L is written in m; write "7 m"']);
    // Same dimension in other units, and a plain number for a plain number, are fine.
    expect(problems({ P: '2 kip', L: '20 ft', gamma_G: '1.35' })).toEqual([]);
    const dir = mkdtempSync(join(tmpdir(), 'vaultbook-set-dim-'));
    const file = join(dir, 'beam.md');
    writeFileSync(file, BEAM);
    const out: string[] = [];
    expect(await main(['check', file, '--set', 'P=5 m'], (s) => out.push(s), (s) => out.push(s))).toBe(2);
    expect(out.join('\n')).toContain('beam.md:4:1  error: --set P: P is force (kN); "5 m" is length (m)');
  });
});

describe('cost: a case re-evaluates exactly its dirty subgraph', () => {
  it('runCases evaluates each cell downstream of the case\'s inputs once and nothing else', async () => {
    const doc = compile(BEAM, { file: 'beam.md' });
    const session = startSession(doc);
    const base = new Map(await session.settle());
    const cases = expandCases(doc, base).cases;
    const before = new Map(session.evaluations);
    const counts: Array<Record<string, number>> = [];
    let last = new Map(before);
    await runCases(session, cases, errorKeys(doc.graph, base), {
      onCase: () => {
        const delta: Record<string, number> = {};
        for (const [id, n] of session.evaluations) if (n !== (last.get(id) ?? 0)) delta[id] = n - (last.get(id) ?? 0);
        counts.push(delta);
        last = new Map(session.evaluations);
      },
    });
    session.dispose();
    // By hand: gamma_G feeds M and R and their checks; x_P the same; V and c_V depend on neither.
    expect(counts[0]).toEqual({ gamma_G: 1, M: 1, R: 1, c_M: 1, c_R: 1 });
    // From EQU to STR only gamma_G changes; from STR to axle[1] gamma_G goes back and x_P changes.
    expect(counts[1]).toEqual({ gamma_G: 1, M: 1, R: 1, c_M: 1, c_R: 1 });
    expect(counts[3]).toEqual({ x_P: 1, M: 1, R: 1, c_M: 1, c_R: 1 });
    for (const delta of counts) expect(new Set(Object.keys(delta))).toEqual(downstreamOf(doc.graph, Object.keys(delta).filter((id) => doc.graph.byId.get(id)!.kind === 'given')));
  });
});

describe('worker threads', () => {
  it('casePool on the main thread and two worker threads gives exactly the single-thread results', async () => {
    const text = BEAM.replace('steps(0.1 * L, 0.9 * L, 5)', 'steps(0.1 * L, 0.9 * L, 8)');
    const single = await evaluateDocument(text, { file: 'beam.md' });
    let used = 0;
    const where: string[] = [];
    const pool = casePool(text, 'beam.md', {}, { jobs: 3, perWorker: 2, onSlice: (w, names) => where.push(`${w}: ${names.join(' ')}`) });
    const pooled = await evaluateDocument(text, { file: 'beam.md', caseRunner: async (cases, here) => { const r = await pool(cases, here); if (r) used++; return r; } });
    expect(used).toBe(1);
    // Ten cases on three threads: slices of 4, 4 and 2, the first on the main thread.
    expect(where.sort()).toEqual(['main thread: EQU STR axle[1] axle[2]', 'worker: axle[3] axle[4] axle[5] axle[6]', 'worker: axle[7] axle[8]'].sort());
    expect(pooled.summary).toEqual(single.summary);
  }, 30_000);
});
