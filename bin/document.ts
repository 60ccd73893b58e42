/**
 * readDocument: how every command reads a calc document from disk (eval, check, render, serve,
 * diff, new). A document is a regular file of at most MAX_DOCUMENT_BYTES that is UTF-8 text:
 *
 * - only regular files are read, so a `.md` that is a symbolic link to a named pipe, a device
 *   (`/dev/urandom`, `/dev/zero`) or a folder is refused at once instead of hanging or reading
 *   without end; the file is opened non-blocking and judged by the opened descriptor, so it cannot
 *   be swapped for a pipe between the check and the read;
 * - no more than the limit is ever read, even from a file that grows while it is read;
 * - a NUL byte or bytes that are not UTF-8 make it "not a text file", located at its line and column.
 */
import { constants, fstatSync, openSync, readSync, closeSync, type Stats } from 'node:fs';
import { open } from 'node:fs/promises';
import { isUtf8 } from 'node:buffer';
import type { Diagnostic, RuleId } from '../engine/diagnostic.js';

/** The largest document any command reads: 10 MiB. */
export const MAX_DOCUMENT_BYTES = 10 * 1024 * 1024;

/** A document that cannot be read, with the reason in the user's words and where (for text faults). */
export class DocumentError extends Error {
  override name = 'DocumentError';
  constructor(readonly file: string, readonly reason: string, readonly ruleId: RuleId = 'io/read', readonly line = 1, readonly column = 1) {
    super(`cannot read ${file}: ${reason}`);
  }

  /** The same problem as a diagnostic, for the JSON output and the archive table. */
  toDiagnostic(): Diagnostic {
    return {
      message: this.ruleId === 'io/read' ? this.message : this.reason, file: this.file,
      line: this.line, column: this.column, endLine: this.line, endColumn: this.column,
      cellId: null, ruleId: this.ruleId, severity: 'error',
    };
  }
}

const OPEN_FLAGS = constants.O_RDONLY | constants.O_NONBLOCK | constants.O_NOCTTY;

function megabytes(n: number): string {
  return `${(n / (1024 * 1024)).toFixed(1)} MB`;
}

const LIMIT_TEXT = `the ${MAX_DOCUMENT_BYTES / (1024 * 1024)} MB limit for a calc document`;

/** Why a file of this kind is not read, or null for a regular file within the limit. */
function refusal(info: Stats): string | null {
  if (info.isDirectory()) return 'it is a folder, not a file';
  if (info.isFIFO()) return 'it is a named pipe (FIFO), not a regular file; vaultbook reads only regular files';
  if (info.isCharacterDevice() || info.isBlockDevice()) return 'it is a device, not a regular file; vaultbook reads only regular files';
  if (info.isSocket()) return 'it is a socket, not a regular file; vaultbook reads only regular files';
  if (!info.isFile()) return 'it is not a regular file; vaultbook reads only regular files';
  if (info.size > MAX_DOCUMENT_BYTES) return `it is ${megabytes(info.size)}, larger than ${LIMIT_TEXT}`;
  return null;
}

function openFailure(file: string, e: unknown): DocumentError {
  const code = (e as NodeJS.ErrnoException).code;
  const reason = code === 'ENOENT' ? 'no such file'
    : code === 'EACCES' || code === 'EPERM' ? 'permission denied'
    : code === 'ELOOP' ? 'too many symbolic links'
    : code === 'EISDIR' ? 'it is a folder, not a file'
    : (e as Error).message;
  return new DocumentError(file, reason);
}

/** Thrown by the readers when more than the limit arrives (a file growing while read). */
function tooLarge(file: string): DocumentError {
  return new DocumentError(file, `it is larger than ${LIMIT_TEXT}`);
}

/**
 * The bytes of a document, read only if it is a regular file within the limit.
 * @throws DocumentError, with the reason in plain words
 * @example const bytes = await readDocumentBytes('calc.md')
 */
export async function readDocumentBytes(file: string): Promise<Buffer> {
  let handle;
  try {
    handle = await open(file, OPEN_FLAGS);
  } catch (e) {
    throw openFailure(file, e);
  }
  try {
    const why = refusal(await handle.stat());
    if (why) throw new DocumentError(file, why);
    const chunks: Buffer[] = [];
    let total = 0;
    for (;;) {
      const chunk = Buffer.allocUnsafe(Math.min(1 << 20, MAX_DOCUMENT_BYTES + 1 - total));
      const { bytesRead } = await handle.read(chunk, 0, chunk.length, null);
      if (bytesRead === 0) break;
      chunks.push(chunk.subarray(0, bytesRead));
      total += bytesRead;
      if (total > MAX_DOCUMENT_BYTES) throw tooLarge(file);
    }
    return Buffer.concat(chunks, total);
  } finally {
    await handle.close();
  }
}

/** readDocumentBytes, synchronous (the live server's write path must not yield). */
export function readDocumentBytesSync(file: string): Buffer {
  let fd: number;
  try {
    fd = openSync(file, OPEN_FLAGS);
  } catch (e) {
    throw openFailure(file, e);
  }
  try {
    const why = refusal(fstatSync(fd));
    if (why) throw new DocumentError(file, why);
    const chunks: Buffer[] = [];
    let total = 0;
    for (;;) {
      const chunk = Buffer.allocUnsafe(Math.min(1 << 20, MAX_DOCUMENT_BYTES + 1 - total));
      const n = readSync(fd, chunk, 0, chunk.length, null);
      if (n === 0) break;
      chunks.push(chunk.subarray(0, n));
      total += n;
      if (total > MAX_DOCUMENT_BYTES) throw tooLarge(file);
    }
    return Buffer.concat(chunks, total);
  } finally {
    closeSync(fd);
  }
}

/** Length of the UTF-8 sequence starting at i, or 0 when the bytes there are not UTF-8. */
function sequenceLength(bytes: Buffer, i: number): number {
  const b = bytes[i]!;
  if (b < 0x80) return 1;
  const cont = (k: number, lo = 0x80, hi = 0xbf) => i + k < bytes.length && bytes[i + k]! >= lo && bytes[i + k]! <= hi;
  if (b >= 0xc2 && b <= 0xdf) return cont(1) ? 2 : 0;
  if (b >= 0xe0 && b <= 0xef) {
    // No overlong forms (E0 80..9F) and no UTF-16 surrogates (ED A0..BF).
    const ok = cont(1, b === 0xe0 ? 0xa0 : 0x80, b === 0xed ? 0x9f : 0xbf) && cont(2);
    return ok ? 3 : 0;
  }
  if (b >= 0xf0 && b <= 0xf4) {
    const ok = cont(1, b === 0xf0 ? 0x90 : 0x80, b === 0xf4 ? 0x8f : 0xbf) && cont(2) && cont(3);
    return ok ? 4 : 0;
  }
  return 0;
}

/**
 * The text of a document's bytes, or a DocumentError ("not a text file") located at the first NUL
 * byte or the first bytes that are not UTF-8. A leading byte order mark is kept (the engine skips it).
 * @example decodeDocument('calc.md', bytes).split('\n').length
 */
export function decodeDocument(file: string, bytes: Buffer): string {
  if (bytes.indexOf(0) < 0 && isUtf8(bytes)) return bytes.toString('utf8');
  let line = 1;
  let column = 1;
  for (let i = 0; i < bytes.length;) {
    const b = bytes[i]!;
    const n = b === 0 ? 0 : sequenceLength(bytes, i);
    if (n === 0) {
      const what = b === 0 ? 'a NUL byte' : `byte 0x${b.toString(16).padStart(2, '0')} (not UTF-8)`;
      throw new DocumentError(file, `not a text file: ${what} at line ${line}, column ${column}; a calc is UTF-8 text`, 'io/not-text', line, column);
    }
    if (b === 0x0a) { line++; column = 1; } else column += n === 4 ? 2 : 1;
    i += n;
  }
  return bytes.toString('utf8');
}

/**
 * A document's text: a regular file within the size limit, holding UTF-8 text.
 * @throws DocumentError
 * @example const text = await readDocument('calc.md')
 */
export async function readDocument(file: string): Promise<{ bytes: Buffer; text: string }> {
  const bytes = await readDocumentBytes(file);
  return { bytes, text: decodeDocument(file, bytes) };
}
