/**
 * Front matter: a YAML mapping between `---` lines at the very top.
 */
import { parseDocument, visit, isMap, isScalar, LineCounter, Scalar, type Document, type YAMLError } from 'yaml';
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
    // The first error is the slip; the rest are usually its echoes further down.
    const { line, column, message } = yamlProblem(doc.errors[0]!, yamlText);
    ctx.diagnostics.push(at(ctx, line + 1, column, `front matter: ${message}`, 'parse/front-matter'));
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

/**
 * Where a YAML error is and what it means, in the front matter's own lines (1-based). An unclosed
 * quote or bracket is reported where it opens, not at the end of the text where the parser gave up.
 */
function yamlProblem(err: YAMLError, text: string): { line: number; column: number; message: string } {
  const lines = text.split('\n');
  const words = err.message.split('\n')[0]!.replace(/ at line \d+, column \d+:?\s*$/, '');
  const opener = /Missing closing (["'])quote/.exec(words)?.[1] ?? (/end with a \]/.test(words) ? '[' : /end with a \}/.test(words) ? '{' : null);
  if (opener) {
    const closer = opener === '[' ? ']' : opener === '{' ? '}' : opener;
    for (let i = 0; i < lines.length; i++) {
      const code = lines[i]!;
      const opens = code.split(opener).length - 1, closes = opener === closer ? 0 : code.split(closer).length - 1;
      if (opener === closer ? opens % 2 === 1 : opens > closes) {
        const kind = opener === '[' ? 'a list [ … ]' : opener === '{' ? 'a record { … }' : `a value in quotes (${opener})`;
        return { line: i + 1, column: code.lastIndexOf(opener) + 1, message: `${kind} opened here is never closed; add ${closer} at its end` };
      }
    }
  }
  const line = err.linePos?.[0]?.line ?? 1, column = err.linePos?.[0]?.col ?? 1;
  const key = /^\s*([^:#]+?)\s*:/.exec(lines[line - 1] ?? '')?.[1];
  const plain: Record<string, string> = {
    DUPLICATE_KEY: `"${key ?? 'this key'}" is given twice; keep one`,
    TAB_AS_INDENT: 'tabs cannot indent front matter; use spaces',
    BLOCK_AS_IMPLICIT_KEY: 'a value containing ": " must be written in quotes, e.g. title: "Bay 3: nave"',
  };
  return { line, column, message: plain[err.code] ?? words };
}
/** Significant figures a document may ask for (README "The document format"). */
export const SIGFIGS = { min: 1, max: 15 } as const;

function at(ctx: StageContext, line: number, column: number, message: string, ruleId: 'parse/front-matter') {
  return { message, file: ctx.file, line, column, endLine: line, endColumn: column, cellId: null, ruleId, severity: 'error' as const };
}
