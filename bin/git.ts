/**
 * Git, run safely in a folder we do not trust.
 *
 * `render`, `serve` and `diff --rev` run git in the document's folder, which may be an unpacked
 * archive from anyone, with a `.git/config` of its own. Git runs programs named in that config
 * (core.fsmonitor, hooks under core.hooksPath, clean/smudge filters and textconv named by
 * .gitattributes, gpg.program with log.showSignature, core.pager …), and commands that look at the
 * working tree (`git status`, `git diff`, `git add`) or show commits (`git show`, `git log`) start
 * them. So vaultbook:
 *
 * - runs only `git rev-parse` (names → object ids) and `git cat-file blob` (an object's raw bytes):
 *   neither reads the index or the working tree, so neither starts fsmonitor, hooks, filters or
 *   textconv; whether the file has uncommitted changes is decided by hashing its bytes as a git
 *   blob here and comparing that id with the blob committed at HEAD;
 * - still overrides, on the command line, every setting it knows that names a program
 *   (core.fsmonitor, core.hooksPath, core.pager, core.sshCommand, …), and sets
 *   GIT_OPTIONAL_LOCKS=0, GIT_TERMINAL_PROMPT=0 and GIT_NO_REPLACE_OBJECTS=1 (replace refs could
 *   make HEAD:calc.md name other bytes than those committed);
 * - never passes a user's argument where git could read it as an option (revisions are checked
 *   by readRevision and follow --end-of-options).
 */
import { execFile } from 'node:child_process';
import { createHash } from 'node:crypto';
import { basename, dirname } from 'node:path';
import type { ArchiveInfo } from '../engine/render/index.js';
import { MAX_DOCUMENT_BYTES } from './document.js';

/** Settings that name a program; each is switched off for every git vaultbook runs. */
const NO_PROGRAMS = [
  'core.fsmonitor=false', 'core.hooksPath=/dev/null', 'core.pager=cat', 'core.sshCommand=false',
  'core.editor=false', 'core.askPass=', 'diff.external=', 'log.showSignature=false', 'gpg.program=false',
  'credential.helper=', 'core.untrackedCache=false', 'protocol.allow=never', 'uploadpack.packObjectsHook=',
].flatMap((setting) => ['-c', setting]);

const SAFE_ENV: NodeJS.ProcessEnv = {
  GIT_OPTIONAL_LOCKS: '0', GIT_TERMINAL_PROMPT: '0', GIT_NO_REPLACE_OBJECTS: '1', GIT_PAGER: 'cat',
  GIT_ASKPASS: '', SSH_ASKPASS: '', GIT_EXTERNAL_DIFF: '',
};

export class GitError extends Error {
  override name = 'GitError';
  constructor(message: string, readonly code: number | string | null) {
    super(message);
  }
}

/** The environment for git: ours, minus anything that would point git at another repository. */
function gitEnv(): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = { ...process.env, ...SAFE_ENV };
  for (const k of ['GIT_DIR', 'GIT_WORK_TREE', 'GIT_INDEX_FILE', 'GIT_OBJECT_DIRECTORY', 'GIT_ALTERNATE_OBJECT_DIRECTORIES', 'GIT_CONFIG', 'GIT_CONFIG_PARAMETERS', 'GIT_CONFIG_COUNT']) delete env[k];
  return env;
}

/**
 * Runs `git <args>` in `cwd` with every program-running setting switched off.
 * @returns stdout as bytes
 * @throws GitError with git's own first line of complaint
 */
export function runGit(args: string[], cwd: string, options: { timeoutMs?: number; maxBytes?: number } = {}): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    execFile('git', [...NO_PROGRAMS, ...args], {
      cwd, env: gitEnv(), encoding: 'buffer', timeout: options.timeoutMs ?? 10_000,
      maxBuffer: options.maxBytes ?? 1 << 20, windowsHide: true,
    }, (error, stdout, stderr) => {
      if (!error) return resolve(stdout);
      const code = (error as NodeJS.ErrnoException).code ?? null;
      const why = code === 'ERR_CHILD_PROCESS_STDIO_MAXBUFFER' ? 'the output is larger than allowed'
        : stderr.toString('utf8').trim().split('\n')[0] || error.message;
      reject(new GitError(why.replace(/^fatal: /, ''), code));
    });
  });
}

/** The id git gives these bytes as a blob (SHA-1, or SHA-256 in a repository of that format). */
export function blobId(bytes: Buffer, format: string): string {
  return createHash(format === 'sha256' ? 'sha256' : 'sha1').update(`blob ${bytes.length}\0`).update(bytes).digest('hex');
}

/** What the archive footer needs from git: the format, HEAD's commit and the file's blob there. */
export interface HeadLookup {
  format: string;
  commit: string;
  /** The file's blob at HEAD; null when the file is not committed. */
  blob: string | null;
}

const HEX = /^[0-9a-f]{40}([0-9a-f]{24})?$/;

/**
 * HEAD's commit and the blob `file` has there, from one `git rev-parse` in the file's folder;
 * null outside a repository or before the first commit.
 */
export async function lookupHead(file: string): Promise<HeadLookup | null> {
  const cwd = dirname(file);
  let out: string;
  try {
    out = (await runGit(['rev-parse', '--show-object-format', 'HEAD', `HEAD:./${basename(file)}`], cwd)).toString('utf8');
  } catch {
    // Not a repository, no commit yet, or the file is not committed at HEAD: ask for HEAD alone.
    const head = await runGit(['rev-parse', '--show-object-format', 'HEAD'], cwd).catch(() => null);
    if (!head) return null;
    out = head.toString('utf8');
  }
  const [format, commit, blob] = out.split('\n').map((l) => l.trim());
  if (!format || !commit || !HEX.test(commit)) return null;
  return { format, commit, blob: blob && HEX.test(blob) ? blob : null };
}

/** SHA-256 of the bytes, with the git commit and dirty state when a lookup is given. */
export function archiveOf(bytes: Buffer, head: HeadLookup | null): ArchiveInfo {
  const hash = createHash('sha256').update(bytes).digest('hex');
  if (!head) return { hash };
  return { hash, commit: head.commit, dirty: head.blob !== blobId(bytes, head.format) };
}

/**
 * The archive identification of a file: SHA-256 of its bytes, and the git commit and whether the
 * bytes differ from those committed there, when it is inside a repository (failing soft).
 * @example await archiveInfo('calc.md', bytes) // {hash, commit: '3f2…', dirty: false}
 */
export async function archiveInfo(file: string, bytes: Buffer): Promise<ArchiveInfo> {
  return archiveOf(bytes, await lookupHead(file));
}

/**
 * Archive look-ups for one file, bounded: at most one git process in flight, shared by every
 * caller that asks meanwhile, and its answer reused for `freshMs` after it arrives (a page loaded
 * by 300 requests at once starts one or two git processes, not 600). Whether the bytes are dirty is
 * decided per call from the bytes themselves, so an edit shows at once; a new commit within freshMs.
 * @example const archive = sharedArchive('calc.md'); await archive(bytes)
 */
export function sharedArchive(file: string, lookup: (file: string) => Promise<HeadLookup | null> = lookupHead, freshMs = 1000, now: () => number = Date.now): (bytes: Buffer) => Promise<ArchiveInfo> {
  let inFlight: Promise<HeadLookup | null> | null = null;
  let last: { head: HeadLookup | null; at: number } | null = null;
  return async (bytes) => {
    if (last && now() - last.at < freshMs) return archiveOf(bytes, last.head);
    inFlight ??= lookup(file).then((head) => {
      last = { head, at: now() };
      return head;
    }).finally(() => { inFlight = null; });
    return archiveOf(bytes, await inFlight);
  };
}

/** Why a revision argument is refused, or null: git must never read it as an option. */
export function revisionProblem(rev: string): string | null {
  if (rev === '') return 'the revision is empty';
  if (rev.startsWith('-')) return `"${rev}" starts with "-"; a revision never does (git would read it as an option)`;
  if (/[\u0000-\u001f\u007f\s]/.test(rev)) return `"${rev}" holds a space or a control character; name a commit, branch or tag such as HEAD~1`;
  if (rev.length > 256) return 'the revision is longer than 256 characters';
  return null;
}

/**
 * The text of `file` as committed at `rev`, without running anything the repository configures:
 * `rev-parse --verify` resolves the commit (after --end-of-options), `cat-file blob` reads the bytes.
 * @throws GitError when the revision is refused, unknown, or the file is not in it
 * @example await readRevision('calcs/hall.md', 'HEAD~1')
 */
export async function readAtRevision(file: string, rev: string): Promise<Buffer> {
  const problem = revisionProblem(rev);
  if (problem) throw new GitError(`--rev ${problem}`, null);
  const cwd = dirname(file);
  const resolved = (await runGit(['rev-parse', '--show-prefix', '--verify', '--end-of-options', `${rev}^{commit}`], cwd).catch((e: GitError) => {
    throw new GitError(`--rev ${rev}: ${/needed a single revision|unknown revision|bad revision/i.test(e.message) ? 'no such commit in this repository' : e.message}`, e.code);
  })).toString('utf8').split('\n');
  // --show-prefix prints an empty line at the top of the repository.
  const [prefix, commit] = [resolved[0] ?? '', (resolved[1] ?? '').trim()];
  if (!HEX.test(commit)) throw new GitError(`--rev ${rev}: no such commit in this repository`, null);
  return runGit(['cat-file', 'blob', `${commit}:${prefix}${basename(file)}`], cwd, { maxBytes: MAX_DOCUMENT_BYTES }).catch((e: GitError) => {
    throw new GitError(e.code === 'ERR_CHILD_PROCESS_STDIO_MAXBUFFER'
      ? `${file} at ${rev} is larger than the ${MAX_DOCUMENT_BYTES / (1024 * 1024)} MB limit for a calc document`
      : `${file} at ${rev}: ${e.message}`, e.code);
  });
}
