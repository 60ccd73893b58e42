/**
 * Mutated calc documents for the fuzzers (test/engine/fuzz.test.ts in-process, and
 * test/bench/fuzz.bench.ts at 10,000 documents in a watched child process).
 *
 * Seeds are the templates and the hostile fixtures; each document applies a few edits:
 * insert a token from a list that mixes ordinary calc text with the hostile inputs of
 * issue 18, delete a stretch, duplicate or move a line, or repeat a token many times.
 * Deterministic for a given document number.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

const ROOT = join(import.meta.dirname, '../..');

/** Seed documents: every template and every hostile fixture. */
export function seedDocuments(): string[] {
  const from = (dir: string) => readdirSync(join(ROOT, dir)).filter((f) => f.endsWith('.md')).sort()
    .map((f) => readFileSync(join(ROOT, dir, f), 'utf8'));
  return [...from('templates'), ...from('test/fixtures/hostile')];
}

export const TOKENS = [
  'L', 't', 'H', 'P', 'x', '=', '==', '<=', '>=', '+', '-', '*', '/', '^', '(', ')', '[', ']', '{', '}', ',', ':', '.', '"', "'",
  '#', ' ', '\n', '\n\n', '```', '```calc\n', '```given\n', '```check\n', '```figure\n', '---\n', '6', '0', '1e308', '1e9', '-1',
  'm', 'kN', 'kN/m', 'to', 'deg', ' m m m m m m m m m m m m m m m m m m m m', 'clamp(', 'interp(', 'max(', 'sum(', 'format(pi, ',
  'zeros(', 'ones(', '1:1e9', '1:1e5', 'size(', 'setPowerset(', 'kron(', 'concat(', 'resize(', 'range(', 'subset(', 'index(',
  'import(', 'config({relTol: 0.5})', 'typed.clear()', 'evaluate("1")', 'createUnit("x")', '.fill(10 kN)', '.push(1)',
  '.constructor', '__proto__', '{f: f(x) = x}', '[g(x) = x]', 'f(x) = x', 'sqrt(-1)', '1/0', 'NaN', 'Infinity',
  '[3 m, 12 m]', '# span [config({}).absTol, 12 m]', '# [typed.clear(), 1 m]', 'x = ', 'y = ', 'L = ', 'm = 2', 'a.b',
  'sigfigs: 1e9\n', 'sigfigs: 0.5\n', 'a: &a\n  b: *a\n', 'x: &a [*a]\n', 'title: *nope\n', '\r\n', '\t', 'é', '∑', '$$',
  '$x$', '<script>alert(1)</script>', '*a*a*a*a*a*a*a*a', '**', '_', '~', '<', '![a', '`',
];

/** A small fast generator (mulberry32): the same document for the same number, everywhere. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Document number n: a seed with 1–8 edits.
 * @param seeds from seedDocuments()
 */
export function mutatedDocument(seeds: string[], n: number): string {
  const rnd = random(n * 2654435761);
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)]!;
  let doc = pick(seeds);
  const edits = 1 + Math.floor(rnd() * 8);
  for (let e = 0; e < edits; e++) {
    const at = Math.floor(rnd() * (doc.length + 1));
    const kind = rnd();
    if (kind < 0.45) {
      doc = doc.slice(0, at) + pick(TOKENS) + doc.slice(at);
    } else if (kind < 0.65) {
      doc = doc.slice(0, at) + doc.slice(at + Math.floor(rnd() * 40));
    } else if (kind < 0.8) {
      const lines = doc.split('\n');
      const i = Math.floor(rnd() * lines.length), j = Math.floor(rnd() * lines.length);
      lines.splice(j, 0, lines[i]!);
      doc = lines.join('\n');
    } else if (kind < 0.95) {
      const lines = doc.split('\n');
      const [moved] = lines.splice(Math.floor(rnd() * lines.length), 1);
      lines.splice(Math.floor(rnd() * lines.length), 0, moved!);
      doc = lines.join('\n');
    } else {
      doc = doc.slice(0, at) + pick(TOKENS).repeat(50 + Math.floor(rnd() * 2000)) + doc.slice(at);
    }
  }
  return doc;
}

/** Problems with one evaluation's diagnostics: each must lie inside the document. */
export function unlocated(text: string, diagnostics: Array<{ line: number; column: number; message: string }>): string[] {
  const lines = text.replace(/\r\n?/g, '\n').split('\n').length;
  return diagnostics
    .filter((d) => !(Number.isInteger(d.line) && d.line >= 1 && d.line <= lines + 1 && Number.isInteger(d.column) && d.column >= 1
      && typeof d.message === 'string' && d.message.length > 0))
    .map((d) => `${d.line}:${d.column} ${d.message}`);
}
