/**
 * Front matter: a YAML mapping between `---` lines at the very top.
 */
import { parseDocument, visit, isMap, isScalar, LineCounter, Scalar, type Document } from 'yaml';
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
  const lines = new LineCounter();
  let doc: Document.Parsed;
  try {
    doc = parseDocument(yamlText, { prettyErrors: true, uniqueKeys: true, lineCounter: lines });
  } catch (e) {
    // The YAML reader recurses on nested flow collections: a stack overflow is a refusal, not a crash.
    ctx.diagnostics.push(at(ctx, 2, 1, `front matter cannot be read: ${(e as Error).message.split('\n')[0]}`, 'parse/front-matter'));
    return { meta: {}, length };
  }
  // Line 1 of the YAML text is line 2 of the document.
  const lineOf = (offset: number | undefined) => lines.linePos(offset ?? 0);
  if (doc.errors.length > 0) {
    for (const err of doc.errors) {
      const line = (err.linePos?.[0]?.line ?? 1) + 1;
      const column = err.linePos?.[0]?.col ?? 1;
      ctx.diagnostics.push(at(ctx, line, column, `front matter: ${err.message.split('\n')[0]}`, 'parse/front-matter'));
    }
    return { meta: {}, length };
  }
  // Aliases (`*name`) are refused: one can make the title block refer to itself, and a
  // circular value breaks every consumer of the metadata. Each becomes an empty value.
  visit(doc, {
    Alias(_key, node) {
      const pos = lineOf(node.range?.[0]);
      ctx.diagnostics.push(at(ctx, pos.line + 1, pos.col,
        `front matter: aliases (*${node.source}) are not supported; write the value out in full`, 'parse/front-matter'));
      return new Scalar(null);
    },
  });
  let data: unknown;
  try {
    data = doc.toJS();
  } catch (e) {
    ctx.diagnostics.push(at(ctx, 2, 1, `front matter cannot be read: ${(e as Error).message.split('\n')[0]}`, 'parse/front-matter'));
    return { meta: {}, length };
  }
  if (data === null || data === undefined) return { meta: {}, length };
  if (typeof data !== 'object' || Array.isArray(data)) {
    ctx.diagnostics.push(at(ctx, 2, 1, 'front matter must be a list of "key: value" lines', 'parse/front-matter'));
    return { meta: {}, length };
  }
  const meta = data as Meta;
  if ('sigfigs' in meta) {
    const s = meta.sigfigs;
    if (!(typeof s === 'number' && Number.isInteger(s) && s >= SIGFIGS.min && s <= SIGFIGS.max)) {
      const pair = isMap(doc.contents) ? doc.contents.items.find((p) => isScalar(p.key) && p.key.value === 'sigfigs') : undefined;
      const pos = lineOf((pair?.value as Scalar | undefined)?.range?.[0] ?? (pair?.key as Scalar | undefined)?.range?.[0]);
      ctx.diagnostics.push(at(ctx, pos.line + 1, pos.col,
        `front matter: sigfigs must be a whole number from ${SIGFIGS.min} to ${SIGFIGS.max}, got ${typeof s === 'string' ? JSON.stringify(s) : String(s)}; values are shown to 4`, 'parse/front-matter'));
      delete meta.sigfigs;
    }
  }
  return { meta, length };
}

/** Significant figures a document may ask for (README "The document format"). */
export const SIGFIGS = { min: 1, max: 15 } as const;

function at(ctx: StageContext, line: number, column: number, message: string, ruleId: 'parse/front-matter') {
  return { message, file: ctx.file, line, column, endLine: line, endColumn: column, cellId: null, ruleId, severity: 'error' as const };
}
