/**
 * splitBlocks: markdown → Block[] with source positions.
 *
 * marked's lexer does the splitting; its tokens carry their raw text but no
 * positions, so positions come from adding up the raw lengths.
 */
import { Lexer } from 'marked';
import { CELL_KINDS, type Block, type CellKind } from '../types.js';
import type { StageContext } from '../diagnostic.js';
import { LineIndex } from './position.js';
import { LIMITS } from '../sandbox/limits.js';

/** Characters one prose paragraph may hold before it is shown as plain text (README "Security model"). */
export const MAX_PARAGRAPH_CHARS = 10_000;
/** Emphasis delimiters (`*`, `_`, `~`) one paragraph may hold before they are shown as themselves. */
export const MAX_DELIMITERS_PER_PARAGRAPH = 1_000;

export type ProsePart = { markdown: string } | { plain: string };

/**
 * Prose cut into what marked's inline pass can take in linear time. marked's inline lexer
 * is quadratic in a paragraph's length (it re-slices the rest after every token) and in its
 * number of emphasis delimiters (it pairs them): a paragraph longer than MAX_PARAGRAPH_CHARS
 * becomes plain text, and in one with more than MAX_DELIMITERS_PER_PARAGRAPH delimiters each
 * is escaped. No real paragraph of a calc comes near either.
 * @example proseParts('A *short* note.') // [{markdown: 'A *short* note.'}]
 */
export function proseParts(markdown: string): ProsePart[] {
  if (markdown.length <= MAX_DELIMITERS_PER_PARAGRAPH) return [{ markdown }];
  const parts: ProsePart[] = [];
  let pending = '';
  for (const paragraph of markdown.split(/(\n[ \t]*\n)/)) {
    if (paragraph.length > MAX_PARAGRAPH_CHARS) {
      if (pending) parts.push({ markdown: pending });
      pending = '';
      parts.push({ plain: paragraph });
      continue;
    }
    let count = 0;
    for (let i = 0; i < paragraph.length; i++) {
      const c = paragraph.charCodeAt(i);
      if (c === 42 || c === 95 || c === 126) count++; // * _ ~
    }
    pending += count > MAX_DELIMITERS_PER_PARAGRAPH ? paragraph.replace(/(?<!\\)([*_~])/g, '\\$1') : paragraph;
  }
  if (pending) parts.push({ markdown: pending });
  return parts;
}

/** Is this fence info string one of ours? */
export function isCalcFence(info: string | undefined): info is CellKind {
  return (CELL_KINDS as readonly string[]).includes((info ?? '').trim());
}

/**
 * Splits a document body into prose and calc blocks.
 * @param source whole document, newlines normalised
 * @param start offset where the body starts (after front matter)
 */
export function splitBlocks(source: string, start: number, ctx: StageContext): Block[] {
  if (source.length > LIMITS.documentChars) {
    ctx.diagnostics.push({
      message: `the document has ${source.length.toLocaleString('en-US')} characters; a calc document may have at most ${LIMITS.documentChars.toLocaleString('en-US')} (split it into several calcs)`,
      file: ctx.file, line: 1, column: 1, endLine: 1, endColumn: 1, cellId: null, ruleId: 'sandbox/limit', severity: 'error',
    });
    return [];
  }
  const lines = new LineIndex(source);
  // Block tokens only: the split needs no inline tokens, and marked's inline pass is
  // quadratic on long runs of emphasis delimiters (`*a*a*a…`).
  const tokens = new Lexer({ gfm: true }).blockTokens(source.slice(start), []);
  const blocks: Block[] = [];
  let offset = start;
  let prose: { from: number; to: number } | null = null;
  const flushProse = () => {
    if (prose && source.slice(prose.from, prose.to).trim() !== '') {
      blocks.push({ kind: 'prose', raw: source.slice(prose.from, prose.to), span: { start: lines.at(prose.from), end: lines.at(prose.to) } });
    }
    prose = null;
  };
  for (const token of tokens) {
    const from = offset;
    const to = offset + token.raw.length;
    offset = to;
    if (token.type === 'code' && isCalcFence(token.lang) && /^\s{0,3}(`{3,}|~{3,})/.test(token.raw)) {
      flushProse();
      const firstNewline = token.raw.indexOf('\n');
      const bodyFrom = firstNewline < 0 ? to : from + firstNewline + 1;
      const closed = /\n\s{0,3}(`{3,}|~{3,})\s*$/.test(token.raw.trimEnd()) || /^\s{0,3}(`{3,}|~{3,})[^\n]*\n\s{0,3}(`{3,}|~{3,})/.test(token.raw);
      if (!closed) {
        const p = lines.at(from);
        ctx.diagnostics.push({
          message: `the ${token.lang} cell opened here is never closed with a fence line`, file: ctx.file,
          line: p.line, column: p.column, endLine: p.line, endColumn: p.column + 3, cellId: null, ruleId: 'parse/cell', severity: 'warning',
        });
      }
      blocks.push({
        kind: 'calc', cellKind: (token.lang as string).trim() as CellKind, raw: token.raw, body: (token as { text: string }).text,
        bodyStart: lines.at(bodyFrom), span: { start: lines.at(from), end: lines.at(to) },
      });
    } else {
      prose = prose ? { from: prose.from, to } : { from, to };
    }
  }
  if (offset < source.length) prose = prose ? { from: prose.from, to: source.length } : { from: offset, to: source.length };
  flushProse();
  return blocks;
}
