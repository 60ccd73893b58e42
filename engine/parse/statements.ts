/**
 * Splits the body of a calc block into statements.
 *
 * One statement per line, except that a line with an open `(`, `[` or `{`
 * continues on the next (mathjs ignores newlines inside brackets). The text
 * after a `#` outside quotes is the statement's comment.
 */
export interface RawStatement {
  /** Code without comments; continuation lines joined by '\n'. */
  code: string;
  /** Comment text of all its lines, joined by a space. */
  comment: string;
  /** For each physical line: offset in `code` where it starts, and its body line index (0-based). */
  lines: Array<{ codeOffset: number; bodyLine: number; column: number }>;
  /** Body line index of the last line. */
  lastLine: number;
  /** Set when brackets were still open at the end of the block. */
  unclosed: boolean;
}

interface LineScan {
  code: string;
  comment: string;
  depth: number;
  quote: string | null;
}

/**
 * Where a line's comment starts: the first `#` outside single or double quotes (-1 if none).
 * @param quote the quote still open from the previous line, if any
 * @param onCode called with each character outside quotes before the comment
 * @returns the index of the `#` and the quote still open at the end of the line
 */
export function commentStart(line: string, quote: string | null = null, onCode?: (c: string) => void): { at: number; quote: string | null } {
  for (let i = 0; i < line.length; i++) {
    const c = line[i]!;
    if (quote) {
      if (c === '\\') i++;
      else if (c === quote) quote = null;
      continue;
    }
    // A ' right after a name or a bracket is mathjs's transpose (or a prime, L'), not a quote.
    if (c === '"' || (c === "'" && !/[\p{L}\p{N}_)\]]/u.test(line[i - 1] ?? ''))) quote = c;
    else if (c === '#') return { at: i, quote: null };
    else onCode?.(c);
  }
  return { at: -1, quote };
}

function scanLine(line: string, depth: number, quote: string | null): LineScan {
  const found = commentStart(line, quote, (c) => {
    if (c === '(' || c === '[' || c === '{') depth++;
    else if (c === ')' || c === ']' || c === '}') depth = Math.max(0, depth - 1);
  });
  const end = found.at < 0 ? line.length : found.at;
  return { code: line.slice(0, end), comment: found.at < 0 ? '' : line.slice(end + 1).trim(), depth, quote: found.quote };
}

/** Splits a cell body into statements, keeping line numbers. */
export function splitStatements(body: string): RawStatement[] {
  const out: RawStatement[] = [];
  const lines = body.split('\n');
  let current: RawStatement | null = null;
  let depth = 0;
  let quote: string | null = null;
  lines.forEach((line, index) => {
    const scan = scanLine(line, depth, quote);
    depth = scan.depth;
    quote = scan.quote;
    if (!current) {
      if (scan.code.trim() === '') return; // blank or comment-only line
      current = { code: '', comment: '', lines: [], lastLine: index, unclosed: false };
    } else {
      current.code += '\n';
    }
    current.lines.push({ codeOffset: current.code.length, bodyLine: index, column: 1 });
    current.code += scan.code;
    if (scan.comment) current.comment = current.comment ? `${current.comment} ${scan.comment}` : scan.comment;
    current.lastLine = index;
    if (depth === 0 && quote === null) {
      out.push(current);
      current = null;
    }
  });
  if (current) {
    (current as RawStatement).unclosed = true;
    out.push(current);
  }
  return out;
}

/** Maps an offset inside a statement's code to (body line, column 1-based). */
export function locateInStatement(stmt: RawStatement, codeOffset: number): { bodyLine: number; column: number } {
  let entry = stmt.lines[0]!;
  for (const l of stmt.lines) if (l.codeOffset <= codeOffset) entry = l;
  return { bodyLine: entry.bodyLine, column: codeOffset - entry.codeOffset + 1 };
}
