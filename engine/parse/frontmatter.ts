/**
 * Front matter: a YAML mapping between `---` lines at the very top.
 */
import { parseDocument } from 'yaml';
import type { Meta } from '../types.js';
import type { StageContext } from '../diagnostic.js';

export interface FrontMatter {
  meta: Meta;
  /** Length of the front matter including both fences (0 when there is none). */
  length: number;
}

const OPEN = /^---[ \t]*\n/;
const CLOSE = /\n(?:---|\.\.\.)[ \t]*(?:\n|$)/;

/**
 * Reads the title block from the top of a document.
 * @returns the parsed mapping and how many characters it occupied
 */
export function readFrontMatter(source: string, ctx: StageContext): FrontMatter {
  const open = OPEN.exec(source);
  if (!open) return { meta: {}, length: 0 };
  const rest = source.slice(open[0].length - 1);
  const close = CLOSE.exec(rest);
  if (!close) {
    ctx.diagnostics.push(at(ctx, 1, 1, 'front matter starts with --- but has no closing --- line', 'parse/front-matter'));
    return { meta: {}, length: 0 };
  }
  const yamlText = rest.slice(1, close.index + 1);
  const length = open[0].length - 1 + close.index + close[0].length;
  const doc = parseDocument(yamlText, { prettyErrors: true, uniqueKeys: true });
  if (doc.errors.length > 0) {
    for (const err of doc.errors) {
      const line = (err.linePos?.[0]?.line ?? 1) + 1;
      const column = err.linePos?.[0]?.col ?? 1;
      ctx.diagnostics.push(at(ctx, line, column, `front matter: ${err.message.split('\n')[0]}`, 'parse/front-matter'));
    }
    return { meta: {}, length };
  }
  const data: unknown = doc.toJS({ maxAliasCount: 50 });
  if (data === null || data === undefined) return { meta: {}, length };
  if (typeof data !== 'object' || Array.isArray(data)) {
    ctx.diagnostics.push(at(ctx, 2, 1, 'front matter must be a list of "key: value" lines', 'parse/front-matter'));
    return { meta: {}, length };
  }
  return { meta: data as Meta, length };
}

function at(ctx: StageContext, line: number, column: number, message: string, ruleId: 'parse/front-matter') {
  return { message, file: ctx.file, line, column, endLine: line, endColumn: column, cellId: null, ruleId, severity: 'error' as const };
}
