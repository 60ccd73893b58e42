/**
 * The corpus of slips in test/fixtures/slips/: each file is a calc with mistakes a new user makes
 * (misspelled fields, duplicates, wrong-dimension and missing or extra arguments to every kernel
 * function, bad front matter, refused names). A line marked `# slip` (or `<!-- slip at N -->` where a
 * comment cannot stand) must get an error diagnostic on that line, `# slip@C` also at column C; no
 * other line may get one; and no message may speak mathjs's or JavaScript's language or carry a
 * stack trace. Adding a slip is adding a marked line.
 */
import { describe, it, expect } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { evaluateDocument, formatDiagnostic } from '../../engine/index.js';

const dir = join(import.meta.dirname, '../fixtures/slips');
const files = readdirSync(dir).filter((f) => f.endsWith('.md')).sort();

/** Words that belong to mathjs's or JavaScript's inside, never to a message for an engineer. */
export const INTERNALS = [
  /\bundefined\b/, /\bnull\b/, /\bNaN\b/, /identifier/, /Scalar\b/, /typed-function/, /\b(Type|Range|Syntax|Reference)Error\b/,
  /\[object/, /\bObject\b/, /BigNumber/, /Fraction/, /\bComplex\b/, /DenseMatrix|SparseMatrix/, /\bMatrix\b/, /\bArray\b/,
  /\bstring\b/, /Unexpected type/, /index: \d/, /\(char \d+\)/, /\bN kN\b/, /\bkg\b[^,;()]*\bs\^/, /Symbol\(/, /prototype/,
  /__proto__/, /\bmathjs\b/, /No access to/, /Cannot read propert/, /is not a function/,
  /\d\.\d{9,}/, // number noise such as -0.23999999999999977
];
/** A stack trace or a source position of our own code. */
const STACK = /\n\s+at |\b\w+\.(ts|js|mjs):\d+/;

interface Slip { line: number; column: number | null; }

function slipsOf(text: string): Slip[] {
  const out: Slip[] = [];
  text.split('\n').forEach((line, i) => {
    const m = /#\s*slip(?:@(\d+))?\b/.exec(line);
    if (m) out.push({ line: i + 1, column: m[1] ? Number(m[1]) : null });
  });
  for (const m of text.matchAll(/<!-- slip at (\d+)/g)) out.push({ line: Number(m[1]), column: null });
  return out;
}

describe('the corpus of slips', () => {
  const all = files.map((f) => ({ file: f, text: readFileSync(join(dir, f), 'utf8') }));

  it('holds at least 60 slips', () => {
    expect(all.reduce((n, { text }) => n + slipsOf(text).length, 0)).toBeGreaterThanOrEqual(60);
  });

  for (const { file, text } of all) {
    it(`${file}: every slip gets an error on its line, and nothing else does`, async () => {
      const { summary } = await evaluateDocument(text, { file });
      const errors = summary.diagnostics.filter((d) => d.severity === 'error');
      const slips = slipsOf(text);
      const shown = errors.map((d) => formatDiagnostic(d)).join('\n');
      for (const s of slips) {
        const here = errors.filter((d) => d.line === s.line);
        expect(here.length, `no error on line ${s.line}:\n${shown}`).toBeGreaterThan(0);
        if (s.column !== null) expect(here.map((d) => d.column), `column on line ${s.line}`).toContain(s.column);
      }
      const stray = errors.filter((d) => !slips.some((s) => s.line === d.line));
      expect(stray.map((d) => formatDiagnostic(d))).toEqual([]);
    });

    it(`${file}: no message speaks mathjs's or JavaScript's language, none carries a stack trace`, async () => {
      const { summary } = await evaluateDocument(text, { file });
      const texts = [
        ...summary.diagnostics.flatMap((d) => [d.message, d.note ?? '', d.actual ?? '', d.expected ?? '']),
        ...Object.values(summary.values).map((v) => v.text),
      ];
      const bad = texts.filter((t) => INTERNALS.some((re) => re.test(t)) || STACK.test(t));
      expect(bad).toEqual([]);
    });
  }
});
