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
  const lines = new LineIndex(source);
  const tokens = new Lexer({ gfm: true }).lex(source.slice(start));
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
