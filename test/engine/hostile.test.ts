/**
 * Hostile inputs (test/fixtures/hostile/*.md, written from issue 18's description, and
 * generated ones too big to keep as files): each answers with located diagnostics and
 * a JSON summary, never a crash, an abort or a hang; a check that fails still fails.
 */
import { describe, it, expect } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { compile, evaluateDocument } from '../../engine/index.js';
import { renderSheet } from '../../engine/render/index.js';
import { proseParts, MAX_PARAGRAPH_CHARS } from '../../engine/parse/blocks.js';
import { LIMITS } from '../../engine/sandbox/index.js';
import { fence } from '../helpers/settle.js';

const dir = join(import.meta.dirname, '../fixtures/hostile');

/** What each fixture must answer: [ruleId, line] of every error, and the verdicts of its checks. */
const EXPECTED: Record<string, { errors: Array<[string, number]>; checks?: Array<boolean | null> }> = {
  'range-config': { errors: [['sandbox/refused', 5]], checks: [false] },
  'range-typed': { errors: [['sandbox/refused', 5]], checks: [false] },
  fill: { errors: [['sandbox/refused', 9]], checks: [false] },
  'nested-functions': { errors: [['sandbox/refused', 5], ['sandbox/refused', 6], ['sandbox/refused', 7]] },
  bombs: {
    errors: [5, 6, 7, 8, 9, 10, 11, 12, 13].map((line) => [line === 8 ? 'sandbox/refused' : 'sandbox/limit', line] as [string, number]),
  },
  'unit-chain': { errors: [] },
  'sigfigs-huge': { errors: [['parse/front-matter', 3]] },
  'sigfigs-fraction': { errors: [['parse/front-matter', 3]] },
  'sigfigs-minus-inf': { errors: [['parse/front-matter', 3]] },
  'yaml-alias-loop': { errors: [['parse/front-matter', 4]] },
  'yaml-self-list': { errors: [['parse/front-matter', 3]] },
  'yaml-unknown-alias': { errors: [['parse/front-matter', 2]] },
};

async function judged(text: string, file: string) {
  const { doc, states, summary } = await evaluateDocument(text, { file });
  const lines = text.split('\n').length;
  for (const d of summary.diagnostics) {
    expect(d.line, JSON.stringify(d)).toBeGreaterThanOrEqual(1);
    expect(d.line, JSON.stringify(d)).toBeLessThanOrEqual(lines);
    expect(d.column, JSON.stringify(d)).toBeGreaterThanOrEqual(1);
  }
  const json = JSON.stringify(summary);
  expect(json.length).toBeGreaterThan(0);
  return { doc, states, summary };
}

describe('hostile fixtures', () => {
  const files = readdirSync(dir).filter((f) => f.endsWith('.md')).map((f) => f.slice(0, -3));

  it('every fixture has its expectation', () => {
    expect(files.sort()).toEqual(Object.keys(EXPECTED).sort());
  });

  for (const name of files) {
    it(`${name}.md: located errors, JSON written, sheet rendered, failing checks still fail`, async () => {
      const text = readFileSync(join(dir, `${name}.md`), 'utf8');
      const { doc, states, summary } = await judged(text, `${name}.md`);
      const errors = summary.diagnostics.filter((d) => d.severity === 'error').map((d) => [d.ruleId, d.line]);
      expect(errors).toEqual(EXPECTED[name]!.errors);
      if (EXPECTED[name]!.checks) expect(summary.checks.map((c) => c.pass)).toEqual(EXPECTED[name]!.checks);
      expect(renderSheet({ doc, states })).toContain('</html>');
    });
  }

  it('sigfigs out of range falls back to 4 figures (55 kN stays 55 kN, not "50 kN")', async () => {
    const { summary } = await evaluateDocument(readFileSync(join(dir, 'sigfigs-fraction.md'), 'utf8'));
    expect(summary.values.x!.text).toBe('55 kN');
  });

  it('the bombs fixture still computes its ordinary line', async () => {
    const { summary } = await evaluateDocument(readFileSync(join(dir, 'bombs.md'), 'utf8'));
    expect(summary.values.ok!.value).toBe(5050);
  });
});

describe('generated hostile documents: long chains never overflow the stack', () => {
  const cases: Record<string, string> = {
    'y = 1 x x … (30,000 times)': fence('calc', 'x = 2', `y = 1 ${Array(30_000).fill('x').join(' ')}`),
    'a product of 4,000 factors': fence('calc', 'x = 2', `y = ${Array(4_000).fill('x').join(' * ')}`),
    '5,000 nested brackets': fence('calc', `y = ${'('.repeat(5_000)}1${')'.repeat(5_000)}`),
    '5,000 nested lists': fence('calc', `y = ${'['.repeat(5_000)}1${']'.repeat(5_000)}`),
    '10,000 unary minus signs': fence('calc', `y = ${'-'.repeat(10_000)}1`),
    'a power tower of 3,000': fence('calc', `y = ${Array(3_000).fill('1').join('^')}`),
    'a range bound nested 5,000 deep': fence('given', `L = 6 m  # span [${'('.repeat(5_000)}1 m${')'.repeat(5_000)}, 12 m]`),
  };
  for (const [what, text] of Object.entries(cases)) {
    it(`compile and evaluate ${what}: a located error, no throw`, async () => {
      expect(() => compile(text)).not.toThrow();
      const { summary } = await judged(text, 'chain.md');
      const d = summary.diagnostics.find((x) => x.ruleId === 'sandbox/limit');
      expect(d, JSON.stringify(summary.diagnostics)).toBeDefined();
    });
  }

  it('a quantity with a complex value (sqrt of a negative area) is a located error, and the summary is written', async () => {
    const { summary } = await judged(fence('calc', 'A = -4 m^2', 'x = sqrt(A)', 'y = [1 m, sqrt(A)]'), 'complex.md');
    expect(summary.diagnostics.map((d) => [d.cellId, d.line])).toEqual([['x', 3], ['y', 4]]);
    expect(summary.values.x!.value).toBeNull();
  });

  it(`a document over ${LIMITS.documentChars.toLocaleString('en-US')} characters is refused at 1:1 and nothing is evaluated`, async () => {
    const text = fence('calc', 'x = 1') + 'a'.repeat(LIMITS.documentChars);
    const { summary } = await judged(text, 'big.md');
    expect(summary.diagnostics).toEqual([expect.objectContaining({ ruleId: 'sandbox/limit', line: 1, column: 1 })]);
    expect(summary.values).toEqual({});
  });

  it(`statements past the ${LIMITS.cells.toLocaleString('en-US')}th are not evaluated, with one diagnostic at the first of them`, async () => {
    const lines = Array.from({ length: LIMITS.cells + 5 }, (_, i) => `x_${i} = ${i}`);
    const { summary } = await judged(fence('calc', ...lines), 'many.md');
    expect(summary.diagnostics).toEqual([expect.objectContaining({ ruleId: 'sandbox/limit', line: LIMITS.cells + 2 })]);
    expect(Object.keys(summary.values)).toHaveLength(LIMITS.cells);
  });

  it('proseParts: a paragraph longer than the limit is plain text, one with a thousand delimiters has them escaped', () => {
    const long = 'x'.repeat(MAX_PARAGRAPH_CHARS + 1);
    expect(proseParts(`Intro *a*.\n\n${long}\n\nOutro.`)).toEqual([{ markdown: 'Intro *a*.\n\n' }, { plain: long }, { markdown: '\n\nOutro.' }]);
    const stars = '*a'.repeat(1_200);
    expect(proseParts(stars)).toEqual([{ markdown: '\\*a'.repeat(1_200) }]);
    expect(proseParts('A *short* note.')).toEqual([{ markdown: 'A *short* note.' }]);
  });

  it('a 200 kB run of "*a" in prose renders with its characters shown as written', async () => {
    const text = `# Notes (fictional)\n\n${'*a'.repeat(100_000)}\n`;
    const { doc, states } = await judged(text, 'stars.md');
    const html = renderSheet({ doc, states });
    expect(html).toContain('*a*a*a');
  });
});
