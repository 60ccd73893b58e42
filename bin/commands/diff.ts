/**
 * `vaultbook diff OLD NEW [--json] [--tol R]` and `vaultbook diff FILE --rev REV`:
 * what changed between two versions of a calc — inputs, results (with %),
 * checks flipped, cells added or removed, prose in summary.
 * Exit 0 normally, 1 when a check fails that did not before, 2 when a version
 * cannot be read or the new version has errors.
 */
import { evaluateDocument } from '../../engine/index.js';
import { parse, JSON_OPTION, UsageError } from '../args.js';
import { definitionsOf, diffDocuments, diffExitCode, type DiffInput } from '../diff/document.js';
import { formatDiff } from '../diff/format.js';
import { decodeDocument, DocumentError, readDocument } from '../document.js';
import { GitError, readAtRevision, revisionProblem } from '../git.js';

class Unreadable extends Error {}

/**
 * The text of `file` as committed at `rev` (see bin/git.ts: nothing the repository configures
 * runs, and the revision can never be read as an option).
 */
async function readRevisionText(file: string, rev: string): Promise<string> {
  try {
    return decodeDocument(`${file}@${rev}`, await readAtRevision(file, rev));
  } catch (e) {
    if (e instanceof GitError || e instanceof DocumentError) throw new Unreadable(e instanceof GitError ? `git: ${e.message}` : e.message);
    throw e;
  }
}

async function readText(file: string): Promise<string> {
  try {
    return (await readDocument(file)).text;
  } catch (e) {
    if (e instanceof DocumentError) throw new Unreadable(e.message);
    throw e;
  }
}

async function evaluateVersion(label: string, text: string): Promise<DiffInput> {
  const { doc, summary } = await evaluateDocument(text, { file: label });
  return { label, summary, blocks: doc.blocks, cells: definitionsOf(doc.graph.cells) };
}

export async function diffCommand(args: string[], out: (s: string) => void, err: (s: string) => void = (s) => process.stderr.write(s + '\n')): Promise<number> {
  const { values, positionals } = parse(args, { ...JSON_OPTION, rev: { type: 'string', short: 'r' }, tol: { type: 'string' } });
  const rev = values.rev as string | undefined;
  const revProblem = rev === undefined ? null : revisionProblem(rev);
  if (revProblem) throw new UsageError(`--rev: ${revProblem}`);
  if (rev !== undefined ? positionals.length !== 1 : positionals.length !== 2) {
    throw new UsageError(rev !== undefined ? 'diff --rev REV takes exactly one FILE' : 'diff takes OLD and NEW files (or one FILE with --rev REV)');
  }
  const tol = values.tol === undefined ? undefined : Number(values.tol);
  if (tol !== undefined && !(tol >= 0 && tol < 1)) throw new UsageError(`--tol expects a relative tolerance such as 0.001, got "${values.tol}"`);
  let a: DiffInput, b: DiffInput;
  try {
    if (rev !== undefined) {
      const file = positionals[0]!;
      const [oldText, newText] = await Promise.all([readRevisionText(file, rev), readText(file)]);
      a = await evaluateVersion(`${file}@${rev}`, oldText);
      b = await evaluateVersion(file, newText);
    } else {
      const [oldText, newText] = await Promise.all(positionals.map(readText));
      a = await evaluateVersion(positionals[0]!, oldText!);
      b = await evaluateVersion(positionals[1]!, newText!);
    }
  } catch (e) {
    if (!(e instanceof Unreadable)) throw e;
    err(`vaultbook diff: ${e.message}`);
    return 2;
  }
  const d = diffDocuments(a, b, { tol });
  out(values.json ? JSON.stringify(d, null, 2) : formatDiff(d));
  return diffExitCode(d);
}
