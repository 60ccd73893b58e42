/**
 * The sandbox corpus: payloads a stranger's calc might carry, each tried wherever an
 * expression enters the engine (a cell, a `[lo, hi]` bound, a `--set` override, a live
 * edit). None may give a value, and none may change what the next document sees: after
 * every payload a failing check must still fail with the same utilization, the inputs it
 * was handed must be unchanged, and mathjs's configuration must be as it was.
 */
import { describe, it, expect } from 'vitest';
import { compile, evaluateDocument, startSession } from '../../engine/index.js';
import { math } from '../../cells/math.js';
import { evaluateNode, evaluateUntrusted, NOT_FOR_DOCUMENTS } from '../../engine/sandbox/index.js';
import { fence } from '../helpers/settle.js';

/** A fictional wall head that cannot take its thrust: 55 kN against 40 kN, utilization 1.375. */
const FAILING = ['# Wall head (fictional)', fence('given', 'H = 55 kN  # thrust on the wall head', 'P = [55 kN, 20 kN]  # axle loads'),
  fence('check', 'c_H = H <= 40 kN  # what the wall head takes', 'c_P = max(P) <= 40 kN  # heaviest axle')].join('\n');

async function failingVerdicts() {
  const { summary } = await evaluateDocument(FAILING, { file: 'failing.md' });
  return {
    checks: summary.checks.map((c) => ({ pass: c.pass, utilization: c.utilization })),
    P: summary.values.P!.text,
    errors: summary.diagnostics.filter((d) => d.severity === 'error').length,
  };
}

const EXPECTED = { checks: [{ pass: false, utilization: 1.375 }, { pass: false, utilization: 1.375 }], P: '[55 kN, 20 kN]', errors: 0 };

/** Expressions that try to reach outside the sandbox or change shared state. */
const PAYLOADS = [
  'config({relTol: 0.5, absTol: 0})', 'config({absTol: 1e9}).absTol * 1 m', 'config.relTol', 'config', 'typed.clear()',
  'typed.addConversion({from: "number", to: "string", convert: 1})', 'typed', 'import({x: 1}, {override: true})',
  'createUnit("kN", "1 N", {override: true})', 'createUnit({foo: "1 m"})', 'evaluate("config({relTol: 1})")',
  'parse("1").compile()', 'compile("1")', 'simplify("x + x")', 'derivative("x^2", "x")', 'resolve("x", {x: 1})',
  'reviver("x", 1)', 'expression.mathWithTransform', 'expression.node', 'on("config", sin)', 'emit("config", 1)',
  'chain(1).done()', 'P.fill(10 kN)', 'P.push(1)', 'P.splice(0, 1)', 'P.reverse()', 'P.sort()', 'P.copyWithin(0, 1)',
  '(P[1] = 10 kN)', '(r.a = 5)', '{f: f(x) = x}', '[g(x) = x]', '{r: {f: f(n) = n}}', '{}.constructor', '"".constructor',
  '"".constructor("return process")()', 'sin.constructor("return 1")()', '{a: 1}["constructor"]', '{a: 1}.__proto__',
  '{__proto__: 1}', '{__proto__: {a: 1}}', '{constructor: 1}', 'L.value', 'L.units', 'L.to("kN")', 'L.clone()', 'unit("m").toString()',
  'matrix([1]).resize([1e9])', 'matrix([1])._data', 'sin.signatures', 'map([1, 2], config)', 'map([1], f(x) = x)',
  'filter([1, 2], config)', 'bignumber(1)', 'fraction(1, 3)', 'bigint(2)', 'numeric(1, "BigNumber")', 'help("sin")',
  'parser()', 'subset({a: 1}, index("constructor"))', 'r[concat("con", "structor")]', 'version', 'solveODE(sin, [0, 1], 1)',
  'Unit.UNITS', 'globalThis', 'process', 'Function("return 1")', 'eval("1")', 'this', 'require("fs")',
];

/** A document where the payload stands in a calc cell; L, P and r are there to be tampered with. */
function asCell(payload: string): string {
  return [fence('given', 'L = 6 m  # span', 'P = [55 kN, 20 kN]  # axle loads'), fence('calc', 'r = {a: 1}', `x = ${payload}`),
    fence('check', 'c = max(P) <= 40 kN')].join('\n');
}

/** The payload as a bound of a given's range. */
function asRange(payload: string): string {
  return [fence('given', `L = 6 m  # span [${payload}, 12 m]`), fence('check', 'L <= 40 m')].join('\n');
}

describe('sandbox corpus: no payload evaluates, none changes what the next document sees', () => {
  const configNow = () => JSON.stringify((math.config as unknown as () => object)());
  const configBefore = configNow();

  it(`has at least 50 payloads (${PAYLOADS.length})`, () => {
    expect(PAYLOADS.length).toBeGreaterThanOrEqual(50);
  });

  it('the failing reference document fails on its own', async () => {
    expect(await failingVerdicts()).toEqual(EXPECTED);
  });

  for (const payload of PAYLOADS) {
    it(`refuses ${payload} in a cell, in a range bound, as --set and as a live edit; the failing check still fails after it`, async () => {
      const cell = await evaluateDocument(asCell(payload), { file: 'hostile.md' });
      expect(cell.summary.values.x?.value ?? null, 'cell gave a value').toBeNull();
      const located = cell.summary.diagnostics.find((d) => d.cellId === 'x' && d.severity === 'error');
      expect(located, `no error on the payload's line for ${payload}`).toBeDefined();
      expect(located!.line).toBe(8);
      // P is unchanged and the check on it still fails in the same document.
      expect(cell.summary.values.P!.text).toBe('[55 kN, 20 kN]');
      expect(cell.summary.checks[0]!.pass).toBe(false);

      // A payload with brackets or commas of its own does not read as a range at all (it stays description);
      // one that does is refused at its line, or kept only to fail when it is evaluated.
      const kept = compile(asRange(payload), { file: 'hostile-range.md' }).graph.byId.get('L')!.range;
      if (kept) expect(() => evaluateNode(kept.loNode), `range ${payload} evaluated`).toThrow();
      const range = await evaluateDocument(asRange(payload), { file: 'hostile-range.md' });
      expect(range.summary.checks[0]!.pass).toBe(true);

      // A refused override is not applied (H keeps the document's 55 kN); an applied one fails to evaluate.
      const setRun = await evaluateDocument(FAILING, { file: 'failing.md', overrides: { H: payload } });
      expect(setRun.summary.diagnostics.some((d) => d.cellId === 'H' && d.severity === 'error'), `--set H=${payload}`).toBe(true);
      const h = setRun.summary.values.H!;
      if (h.value !== null) expect(h.text, `--set H=${payload}`).toBe('55 kN');
      expect(setRun.summary.checks[0]!.pass, `--set H=${payload} made the check hold`).not.toBe(true);

      const session = startSession(compile(FAILING, { file: 'failing.md' }));
      const refused = session.setInput('H', payload);
      const states = await session.settle();
      expect(refused !== null || states.get('H')!.status === 'error', `live edit H=${payload} evaluated`).toBe(true);
      session.dispose();

      expect(await failingVerdicts()).toEqual(EXPECTED);
      expect(configNow()).toBe(configBefore);
    });
  }

  it('a hostile file and a failing file in one process, in both orders: the failing check still fails', async () => {
    const hostile = [fence('given', 'L = 6 m  # span [config({relTol: 0.5, absTol: 0}).absTol * 1 m, 12 m]', 'Q = 1 m  # [typed.clear(), 12 m]'),
      fence('check', 'L <= 40 m')].join('\n');
    expect(await failingVerdicts()).toEqual(EXPECTED);
    const first = await evaluateDocument(hostile, { file: 'hostile.md' });
    expect(first.summary.diagnostics.filter((d) => d.ruleId === 'sandbox/refused').map((d) => d.line)).toEqual([2, 3]);
    expect(await failingVerdicts()).toEqual(EXPECTED);
    await evaluateDocument(hostile, { file: 'hostile.md' });
    expect(await failingVerdicts()).toEqual(EXPECTED);
  });

  it('math.config({…}) is refused even when called from JavaScript, and leaves the configuration as it was', () => {
    expect(() => math.config({ relTol: 0.5 })).toThrow(/configuration is fixed/);
    expect(configNow()).toBe(configBefore);
  });

  it('values handed between cells are frozen: no JavaScript path can change an input another cell reads', async () => {
    const session = startSession(compile(fence('given', 'P = [55 kN, 20 kN]'), { file: 'p.md' }));
    const p = (await session.settle()).get('P')!;
    expect(p.status).toBe('ok');
    const value = (p as { value: unknown[] }).value;
    expect(Object.isFrozen(value)).toBe(true);
    expect(Object.isFrozen(value[0])).toBe(true);
    expect(() => { (value as unknown[]).fill(0); }).toThrow(TypeError);
  });

  it('evaluateUntrusted (load cases, live edits) refuses through the same gate and never throws', () => {
    for (const payload of PAYLOADS) {
      const r = evaluateUntrusted(payload);
      expect(r.ok, payload).toBe(false);
    }
    const ok = evaluateUntrusted('55 kN');
    expect(ok.ok && math.isUnit(ok.value) && (ok.value as { toNumber(u: string): number }).toNumber('kN')).toBe(55);
  });

  it('every name the sandbox withholds is refused by name', () => {
    for (const name of NOT_FOR_DOCUMENTS) {
      expect(evaluateUntrusted(`${name}(1)`).ok, name).toBe(false);
    }
  });
});
