import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { evaluateDocument, compile } from '../../engine/index.js';
import { mutatedDocument, seedDocuments, unlocated } from '../helpers/mutate.js';

const SEED = ['---', 'title: Fictional fuzz seed', 'revision: A', '---', '# Ring', '',
  '```given', 'L = 6.4 m  # span [3 m, 12 m]', 't = 0.23 m  # ring', 'gamma = 18 kN/m^3', 'w = 10 kN/m', '```', '',
  '```calc', 'q = gamma * t to kN/m^2', 'H = w * L^2 / (8 * 1.6 m) to kN', 'x = clamp(L, 3 m, 5 m)',
  'y = interp(4 m, [3 m, 5 m], [1 kN, 3 kN])', 'r = {a: L, b: [1, 2]}', '```', '',
  '```check', 'c_H = H <= 100 kN  # thrust', 'L / t >= 20', '```', '', '```figure', '"not a figure"', '```', ''].join('\n');

const TOKENS = ['L', 't', 'gamma', 'H', 'q', '=', '==', '<=', '>=', '+', '-', '*', '/', '^', '(', ')', '[', ']', '{', '}',
  ',', ':', '.', '"', "'", '#', ' ', '\n', '```', '```calc\n', '```given\n', '```check\n', '---\n', '6', '0', '1e308', 'm', 'kN',
  'to', 'deg', 'clamp(', 'interp(', 'import(', 'constructor', '__proto__', 'evaluate("1")', 'sqrt(-1)', '1/0', 'NaN',
  '[3 m, 12 m]', 'x = ', 'y = ', 'L = ', 'm = 2', 'a.b', '\r\n', '\t', 'é', '∑', '$$', '<script>'];

const tokenDoc = fc.array(fc.constantFrom(...TOKENS), { maxLength: 80 }).map((ts) => ts.join(''));
const mutated = fc.tuple(fc.array(fc.tuple(fc.nat(SEED.length), fc.nat(12), fc.string({ maxLength: 6 })), { maxLength: 6 }))
  .map(([edits]) => edits.reduce((s, [at, del, ins]) => s.slice(0, at % (s.length + 1)) + ins + s.slice(at % (s.length + 1) + del), SEED));
const lineShuffle = fc.shuffledSubarray(SEED.split('\n'), { minLength: 1 }).map((ls) => ls.join('\n'));

async function assertWellBehaved(text: string) {
  const lines = text.replace(/\r\n?/g, '\n').split('\n').length;
  const { summary } = await evaluateDocument(text, { file: 'fuzz.md' });
  for (const d of summary.diagnostics) {
    expect(d.line, JSON.stringify(d)).toBeGreaterThanOrEqual(1);
    expect(d.line, JSON.stringify(d)).toBeLessThanOrEqual(lines + 1);
    expect(d.column).toBeGreaterThanOrEqual(1);
    expect(typeof d.message).toBe('string');
  }
  // JSON output must always serialise.
  expect(() => JSON.stringify(summary)).not.toThrow();
}

describe('engine on random and mutated documents (fast-check)', () => {
  it('the seed document itself evaluates', async () => {
    const { summary } = await evaluateDocument(SEED);
    expect(summary.values.H!.text).toBe('32 kN');
    expect(summary.diagnostics.map((d) => d.ruleId)).toEqual(['value/type']);
  });

  it('never throws and locates every diagnostic, on token soup', async () => {
    await fc.assert(fc.asyncProperty(tokenDoc, assertWellBehaved), { numRuns: 150, seed: 20261202 });
  });

  it('never throws and locates every diagnostic, on mutations of a real calc', async () => {
    await fc.assert(fc.asyncProperty(mutated, assertWellBehaved), { numRuns: 150, seed: 7 });
  });

  it('never throws on shuffled subsets of a real calc', async () => {
    await fc.assert(fc.asyncProperty(lineShuffle, assertWellBehaved), { numRuns: 100, seed: 11 });
  });

  // The same generator as `npm run bench`'s 10,000-document fuzz (test/bench/fuzz.bench.ts), on its first 100:
  // templates and issue 18's hostile fixtures, mutated with hostile tokens.
  it('never throws and locates every diagnostic, on 100 mutated templates and hostile fixtures', async () => {
    const seeds = seedDocuments();
    for (let n = 0; n < 100; n++) {
      const text = mutatedDocument(seeds, n);
      const { summary } = await evaluateDocument(text, { file: `fuzz-${n}.md` });
      expect(unlocated(text, summary.diagnostics), `document ${n}`).toEqual([]);
      expect(() => JSON.stringify(summary)).not.toThrow();
    }
  }, 120_000);

  it('compile never throws on arbitrary unicode text', () => {
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 300 }), (s) => { compile(s); }), { numRuns: 300, seed: 3 });
  });
});
