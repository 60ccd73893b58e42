import type { Position } from '../types.js';

/** Maps offsets of a text to 1-based line/column positions. */
export class LineIndex {
  private readonly starts: number[] = [0];

  constructor(readonly text: string) {
    for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === 10) this.starts.push(i + 1);
  }

  /** Position of a 0-based offset (clamped to the text). */
  at(offset: number): Position {
    const o = Math.max(0, Math.min(offset, this.text.length));
    let lo = 0, hi = this.starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (this.starts[mid]! <= o) lo = mid; else hi = mid - 1;
    }
    return { line: lo + 1, column: o - this.starts[lo]! + 1, offset: o };
  }
}

/** CRLF and lone CR become LF, so offsets are the same on every platform. */
export function normaliseNewlines(source: string): string {
  return source.replace(/\r\n?/g, '\n');
}
