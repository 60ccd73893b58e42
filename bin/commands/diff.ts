/**
 * `vaultbook diff OLD NEW [--json] [--tol R]` and `vaultbook diff FILE --rev REV`:
 * what changed between two versions of a calc — inputs, results (with %),
 * checks flipped, cells added or removed, prose in summary.
 * Exit 0 normally, 1 when a check fails that did not before, 2 when a version
 * cannot be read or the new version has errors.
 */
import { readFile } from 'node:fs/promises';
import { execFile } from 'node:child_process';
import { basename, dirname } from 'node:path';
import { evaluateDocument } from '../../engine/index.js';
import { parse, JSON_OPTION, UsageError } from '../args.js';
import { definitionsOf, diffDocuments, diffExitCode, type DiffInput } from '../diff/document.js';
import { formatDiff } from '../diff/format.js';

class Unreadable extends Error {}

/** Runs git in `cwd` and returns stdout; failures become Unreadable with git's own words. */
function git(args: string[], cwd: string): Promise<string> {
  return new Promise((resolve, reject) => {
    execFile('git', args, { cwd, maxBuffer: 64 * 1024 * 1024, encoding: 'utf8' }, (error, stdout, stderr) => {
      if (error) {
        const why = (stderr || error.message).trim().split('\n')[0];
        reject(new Unreadable(`git ${args.join(' ')}: ${why}`));
      } else resolve(stdout);
    });
  });
}

/**
 * The text of `file` as committed at `rev`: `git show REV:path`, the path taken
 * relative to the repository root from the file's own folder, so it works from anywhere.
 */
export async function readAtRevision(file: string, rev: string): Promise<string> {
  const dir = dirname(file);
  const prefix = (await git(['rev-parse', '--show-prefix'], dir)).trim();
  return git(['show', `${rev}:${prefix}${basename(file)}`], dir);
}

async function readText(file: string): Promise<string> {
  try {
    return await readFile(file, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw new Unreadable(`cannot read ${file}: ${code === 'ENOENT' ? 'no such file' : (e as Error).message}`);
  }
}

async function evaluateVersion(label: string, text: string): Promise<DiffInput> {
  const { doc, summary } = await evaluateDocument(text, { file: label });
  return { label, summary, blocks: doc.blocks, cells: definitionsOf(doc.graph.cells) };
}

export async function diffCommand(args: string[], out: (s: string) => void, err: (s: string) => void = (s) => process.stderr.write(s + '\n')): Promise<number> {
  const { values, positionals } = parse(args, { ...JSON_OPTION, rev: { type: 'string', short: 'r' }, tol: { type: 'string' } });
  const rev = values.rev as string | undefined;
  if (rev !== undefined ? positionals.length !== 1 : positionals.length !== 2) {
    throw new UsageError(rev !== undefined ? 'diff --rev REV takes exactly one FILE' : 'diff takes OLD and NEW files (or one FILE with --rev REV)');
  }
  const tol = values.tol === undefined ? undefined : Number(values.tol);
  if (tol !== undefined && !(tol >= 0 && tol < 1)) throw new UsageError(`--tol expects a relative tolerance such as 0.001, got "${values.tol}"`);
  let a: DiffInput, b: DiffInput;
  try {
    if (rev !== undefined) {
      const file = positionals[0]!;
      const [oldText, newText] = await Promise.all([readAtRevision(file, rev), readText(file)]);
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
