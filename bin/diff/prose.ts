/**
 * diffProse: the prose of two versions of a calc → which paragraphs changed.
 *
 * The engineer reviewing a revision wants to know that the narrative moved
 * ("3 paragraphs changed, 1 added"), not a character diff. Paragraphs are the
 * units of a longest-common-subsequence diff; inside a run of edits, a removed
 * paragraph facing an added one counts as one changed paragraph. Re-wrapping a
 * paragraph is not a change: whitespace is collapsed before comparing.
 * Pure: no Node imports.
 */
import type { Block } from '../../engine/index.js';

export interface Paragraph {
  /** First line in its document. */
  line: number;
  text: string;
}

export interface ParagraphChange {
  change: 'changed' | 'added' | 'removed';
  old: Paragraph | null;
  new: Paragraph | null;
}

export interface ProseDiff {
  changed: number;
  added: number;
  removed: number;
  /** Line-level counts over all prose (blank lines ignored). */
  lines_added: number;
  lines_removed: number;
  paragraphs: ParagraphChange[];
}

/** The paragraphs of a document's prose blocks, in order. */
export function paragraphsOf(blocks: Block[]): Paragraph[] {
  const out: Paragraph[] = [];
  for (const b of blocks) {
    if (b.kind !== 'prose') continue;
    let current: string[] = [];
    let start = 0;
    const lines = b.raw.split('\n');
    const flush = () => {
      if (current.length > 0) out.push({ line: start, text: current.join('\n') });
      current = [];
    };
    lines.forEach((l, i) => {
      if (l.trim() === '') return flush();
      if (current.length === 0) start = b.span.start.line + i;
      current.push(l.trimEnd());
    });
    flush();
  }
  return out;
}

type Op = { op: 'same' | 'del' | 'ins'; a: number; b: number };

/** Edit script between two key sequences by longest common subsequence (O(n·m), fine for documents). */
export function editScript(a: string[], b: string[]): Op[] {
  const n = a.length, m = b.length;
  const lcs: Uint32Array[] = Array.from({ length: n + 1 }, () => new Uint32Array(m + 1));
  for (let i = n - 1; i >= 0; i--) {
    for (let j = m - 1; j >= 0; j--) {
      lcs[i]![j] = a[i] === b[j] ? lcs[i + 1]![j + 1]! + 1 : Math.max(lcs[i + 1]![j]!, lcs[i]![j + 1]!);
    }
  }
  const ops: Op[] = [];
  let i = 0, j = 0;
  while (i < n || j < m) {
    if (i < n && j < m && a[i] === b[j]) ops.push({ op: 'same', a: i++, b: j++ });
    else if (j < m && (i >= n || lcs[i]![j + 1]! >= lcs[i + 1]![j]!)) ops.push({ op: 'ins', a: i, b: j++ });
    else ops.push({ op: 'del', a: i++, b: j });
  }
  return ops;
}

const key = (text: string) => text.replace(/\s+/g, ' ').trim();

/**
 * Compares the prose of two documents.
 * @example diffProse(oldDoc.blocks, newDoc.blocks) // {changed: 3, added: 1, removed: 0, …}
 */
export function diffProse(oldBlocks: Block[], newBlocks: Block[]): ProseDiff {
  const a = paragraphsOf(oldBlocks), b = paragraphsOf(newBlocks);
  const ops = editScript(a.map((p) => key(p.text)), b.map((p) => key(p.text)));
  const paragraphs: ParagraphChange[] = [];
  // Walk runs of edits between unchanged paragraphs, pairing removals with additions.
  for (let k = 0; k < ops.length;) {
    if (ops[k]!.op === 'same') { k++; continue; }
    const dels: number[] = [], inss: number[] = [];
    for (; k < ops.length && ops[k]!.op !== 'same'; k++) {
      if (ops[k]!.op === 'del') dels.push(ops[k]!.a); else inss.push(ops[k]!.b);
    }
    const paired = Math.min(dels.length, inss.length);
    for (let p = 0; p < paired; p++) paragraphs.push({ change: 'changed', old: a[dels[p]!]!, new: b[inss[p]!]! });
    for (const d of dels.slice(paired)) paragraphs.push({ change: 'removed', old: a[d]!, new: null });
    for (const s of inss.slice(paired)) paragraphs.push({ change: 'added', old: null, new: b[s]! });
  }
  const linesOf = (ps: Paragraph[]) => ps.flatMap((p) => p.text.split('\n').map((l) => l.trim()));
  const lineOps = editScript(linesOf(a), linesOf(b));
  return {
    changed: paragraphs.filter((p) => p.change === 'changed').length,
    added: paragraphs.filter((p) => p.change === 'added').length,
    removed: paragraphs.filter((p) => p.change === 'removed').length,
    lines_added: lineOps.filter((o) => o.op === 'ins').length,
    lines_removed: lineOps.filter((o) => o.op === 'del').length,
    paragraphs,
  };
}
