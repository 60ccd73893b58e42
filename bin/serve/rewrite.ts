/**
 * rewriteGivenValues: put new input values into a calc document's text.
 *
 * Only the value text of each changed `given` statement is replaced, i.e. the
 * expression between `name =` and the `#` comment. Everything else — other
 * lines, comments, line endings (LF, CRLF or CR), the byte order mark — is
 * kept exactly as it was. The column where a comment starts is kept where
 * the new value leaves room, so aligned comment columns stay aligned.
 *
 * Pure: no I/O. The server reads, calls this, and writes atomically.
 */
import { compile } from '../../engine/index.js';
import type { Cell } from '../../engine/index.js';
import { parseExpression } from '../../cells/math.js';
import { commentStart } from '../../engine/parse/statements.js';
import { sameValue, valueOfText } from '../../engine/values/input-value.js';

/** A change that cannot be written; nothing is rewritten when one is raised. */
export class RewriteError extends Error {
  override name = 'RewriteError';
}

export interface RewriteResult {
  /** The new document text. */
  text: string;
  /** Names whose value text was replaced (in document order). */
  changed: string[];
  /** Things the writer should tell the user (comments moved onto their own lines). */
  notes: string[];
}

const NAME_AT = (name: string) => new RegExp(`^(\\s*${name}\\s*=(?!=)\\s*)`);

/** Splits text into lines, each with the line ending it had ('' for the last). */
function splitLines(text: string): Array<{ body: string; eol: string }> {
  const out: Array<{ body: string; eol: string }> = [];
  const re = /\r\n|\r|\n/g;
  let start = 0;
  for (let m = re.exec(text); m; m = re.exec(text)) {
    out.push({ body: text.slice(start, m.index), eol: m[0] });
    start = m.index + m[0].length;
  }
  out.push({ body: text.slice(start), eol: '' });
  return out;
}

/** Display width in code points, so a comment column lines up after non-ASCII values. */
function width(s: string): number {
  return [...s].length;
}

/** Refuses a value that would not stay one statement on one line. */
function checkValueText(name: string, value: string): string {
  const v = value.trim();
  if (v === '') throw new RewriteError(`${name}: the new value is empty`);
  if (/[\r\n]/.test(v)) throw new RewriteError(`${name}: the new value must be one line, got ${JSON.stringify(value)}`);
  if (commentStart(v).at >= 0) throw new RewriteError(`${name}: the new value must not contain "#" (it would start a comment): ${v}`);
  try {
    parseExpression(v);
  } catch (e) {
    throw new RewriteError(`${name}: cannot read the new value "${v}": ${(e as Error).message}`);
  }
  return v;
}

/** The given cell called `name`, or a RewriteError saying why there is none. */
function findGiven(doc: ReturnType<typeof compile>, name: string): Cell {
  const found = doc.graph.cells.filter((c) => c.name === name);
  const twice = doc.diagnostics.some((d) => d.ruleId === 'graph/duplicate' && d.cellId === name);
  if (found.length > 1 || twice) throw new RewriteError(`${name}: the document defines "${name}" more than once; fix that first`);
  if (found.length === 0) throw new RewriteError(`${name}: the document has no input called "${name}"`);
  if (found[0]!.kind !== 'given') throw new RewriteError(`${name}: "${name}" is a ${found[0]!.kind} value, not a given input`);
  return found[0]!;
}

/** Pads a new expression so that the comment after it starts where it did. */
function padding(oldRegion: string, oldExpr: string, newExpr: string, hasComment: boolean): string {
  const oldPad = oldRegion.slice(oldExpr.length);
  if (!hasComment || oldPad.includes('\t')) return oldPad;
  const keepAtLeast = oldPad.length > 0 ? 1 : 0;
  return ' '.repeat(Math.max(keepAtLeast, width(oldRegion) - width(newExpr)));
}

/** Do two value texts evaluate (through the sandbox) to the same value? False when either does not evaluate. */
function sameWrittenValue(a: string, b: string): boolean {
  const x = valueOfText(a), y = valueOfText(b);
  return x !== undefined && y !== undefined && sameValue(x, y);
}

/**
 * Replaces the value text of changed given inputs.
 * @param source the document exactly as read from disk
 * @param changes input name → new value text (e.g. {L: '7 m'}); a value equal to the document's is skipped
 * @returns the new text and the names changed; throws RewriteError (and changes nothing) when a change cannot be made
 * @example rewriteGivenValues('```given\nL = 6.4 m   # span\n```\n', {L: '7 m'}).text
 *          // '```given\nL = 7 m     # span\n```\n'
 */
export function rewriteGivenValues(source: string, changes: Record<string, string>): RewriteResult {
  if (typeof source !== 'string') throw new TypeError('rewriteGivenValues: expected source to be a string');
  const doc = compile(source);
  const lines = splitLines(source);
  const targets: Array<{ cell: Cell; value: string }> = [];
  for (const [name, raw] of Object.entries(changes)) {
    const cell = findGiven(doc, name);
    const value = checkValueText(name, raw);
    // The document's value written another way (6.40 m for 6.4 m, 6400 mm) is no change: the file keeps its text.
    if (value !== cell.source && !sameWrittenValue(value, cell.source)) targets.push({ cell, value });
  }
  targets.sort((a, b) => b.cell.span.start.line - a.cell.span.start.line);
  const notes: string[] = [];
  // Work bottom-up so earlier line numbers stay valid while lines are removed.
  for (const { cell, value } of targets) {
    const name = cell.name!;
    const first = cell.span.start.line - 1;
    const last = cell.span.end.line - 1;
    const head = lines[first]!.body;
    const m = NAME_AT(name).exec(head);
    if (!m) throw new RewriteError(`${name}: cannot find "${name} =" at the start of line ${first + 1}`);
    const prefix = m[1]!;
    // Where does the code of the first line end, and where does its comment start?
    const hash = commentStart(head.slice(prefix.length));
    const codeEnd = hash.at >= 0 ? prefix.length + hash.at : head.length;
    const region = head.slice(prefix.length, codeEnd);
    const comment = hash.at >= 0 ? head.slice(codeEnd) : '';
    const pad = padding(region, region.trimEnd(), value, comment !== '');
    lines[first] = { body: prefix + value + pad + comment, eol: lines[first]!.eol };
    // Continuation lines of a multi-line value: keep each comment at its column, drop the code.
    let quote = hash.quote;
    const kept: Array<{ body: string; eol: string }> = [];
    for (let i = first + 1; i <= last; i++) {
      const line = lines[i]!;
      const c = commentStart(line.body, quote);
      quote = c.quote;
      if (c.at >= 0) kept.push({ body: ' '.repeat(width(line.body.slice(0, c.at))) + line.body.slice(c.at), eol: line.eol });
    }
    if (last > first) {
      // The last removed line's ending belongs to the statement's last line.
      if (kept.length === 0) lines[first]!.eol = lines[last]!.eol;
      else kept[kept.length - 1]!.eol = lines[last]!.eol;
      lines.splice(first + 1, last - first, ...kept);
      if (kept.length) notes.push(`${name}: the value now fits on line ${first + 1}; the comments of its other lines were kept on their own lines`);
    }
  }
  const text = lines.map((l) => l.body + l.eol).join('');
  if (targets.length) verify(doc.graph.cells, text, targets.map((t) => [t.cell.name!, t.value]));
  return { text, changed: targets.map((t) => t.cell.name!).reverse(), notes };
}

/**
 * Compiles the result and compares it with the original: every cell must be
 * unchanged except the rewritten inputs, which must read exactly the new value.
 * A failure here is a bug in the rewrite, so nothing is written.
 */
function verify(a: Cell[], after: string, changed: Array<[string, string]>): void {
  const b = compile(after).graph.cells;
  const want = new Map(changed);
  const same = a.length === b.length && a.every((c, i) => {
    const d = b[i]!;
    const source = c.name !== null && want.has(c.name) ? want.get(c.name) : c.source;
    return c.name === d.name && c.kind === d.kind && d.source === source;
  });
  if (!same) throw new RewriteError('the rewritten document would not read back as intended; nothing was written (please report this)');
}
