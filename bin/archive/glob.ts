/**
 * expandPatterns: command-line paths and globs → a sorted list of files.
 *
 * Node 20 has no fs.glob, and a firm's archive is usually named with a quoted
 * pattern (`vaultbook check "jobs/**\/*.md"`) that the shell leaves alone, so
 * the patterns are matched here: `*` and `?` within one path segment, `**`
 * across any number of segments. Hidden folders and node_modules are skipped
 * while walking, since calcs never live there and they can be huge.
 */
import { readdir, stat } from 'node:fs/promises';
import { join, sep } from 'node:path';

export interface Expansion {
  /** Files to evaluate, in command-line order, each pattern's matches sorted; no duplicates. */
  files: string[];
  /** Patterns that matched no file: reported as errors, not silently dropped. */
  unmatched: string[];
}

/** Does this argument contain a glob wildcard? */
export function isGlob(arg: string): boolean {
  return /[*?]/.test(arg);
}

/**
 * The RegExp for a glob over '/'-separated relative paths.
 * @example globToRegExp('**\/*.md').test('a/b/c.md') // true
 */
export function globToRegExp(glob: string): RegExp {
  let re = '';
  for (let i = 0; i < glob.length; i++) {
    const ch = glob[i]!;
    if (ch === '*' && glob[i + 1] === '*') {
      // `**/` may match no folder at all; a bare `**` matches anything.
      if (glob[i + 2] === '/') { re += '(?:[^/]*/)*'; i += 2; } else { re += '.*'; i += 1; }
    } else if (ch === '*') {
      re += '[^/]*';
    } else if (ch === '?') {
      re += '[^/]';
    } else {
      re += ch.replace(/[.+^${}()|[\]\\]/g, '\\$&');
    }
  }
  return new RegExp(`^${re}$`);
}

/** Splits a pattern into the folder to start from (no wildcards) and the rest to match. */
function splitBase(pattern: string): { base: string; rest: string } {
  const parts = pattern.split('/');
  const first = parts.findIndex(isGlob);
  const baseParts = parts.slice(0, first);
  const base = baseParts.length === 0 ? '.' : baseParts.join('/') || '/';
  return { base, rest: parts.slice(first).join('/') };
}

const SKIPPED_FOLDERS = new Set(['node_modules']);

/** Every file under `base` (relative paths with '/'), descending at most `depth` levels. */
async function walk(base: string, depth: number): Promise<string[]> {
  const found: string[] = [];
  const visit = async (dir: string, rel: string, level: number): Promise<void> => {
    let entries;
    try {
      entries = await readdir(dir, { withFileTypes: true });
    } catch {
      return; // an unreadable folder holds nothing we can check
    }
    for (const e of entries) {
      const relPath = rel ? `${rel}/${e.name}` : e.name;
      if (e.isDirectory()) {
        if (level + 1 < depth && !e.name.startsWith('.') && !SKIPPED_FOLDERS.has(e.name)) await visit(join(dir, e.name), relPath, level + 1);
      } else if (e.isFile() || e.isSymbolicLink()) {
        found.push(relPath);
      }
    }
  };
  await visit(base, '', 0);
  return found;
}

/**
 * Expands each argument: a glob to the files it matches, a folder to the .md files
 * below it, anything else kept as given (a missing file is reported when read).
 * @param args paths and patterns as typed, '/' or the platform separator
 * @example await expandPatterns(['jobs/**\/*.md', 'extra.md'])
 */
export async function expandPatterns(args: string[]): Promise<Expansion> {
  const files: string[] = [];
  const seen = new Set<string>();
  const unmatched: string[] = [];
  const add = (f: string) => {
    if (!seen.has(f)) { seen.add(f); files.push(f); }
  };
  for (const raw of args) {
    let arg = sep === '\\' ? raw.replaceAll('\\', '/') : raw;
    if (!isGlob(arg)) {
      const info = await stat(arg).catch(() => null);
      if (!info?.isDirectory()) { add(raw); continue; }
      arg = `${arg.replace(/\/+$/, '')}/**/*.md`;
    }
    const { base, rest } = splitBase(arg);
    const re = globToRegExp(rest);
    const depth = rest.includes('**') ? Infinity : rest.split('/').length;
    const matches = (await walk(base, depth)).filter((p) => re.test(p)).sort();
    if (matches.length === 0) unmatched.push(raw);
    const prefix = base === '.' && !arg.startsWith('./') ? '' : base === '/' ? '/' : `${base}/`;
    for (const m of matches) add(prefix + m);
  }
  return { files, unmatched };
}
