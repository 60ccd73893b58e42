/**
 * writeFileAtomic: replace a file so that a reader (or a crash) sees either
 * the old bytes or the new bytes, never a mix.
 *
 * The new text goes to a temporary file in the same directory (same file
 * system, so rename is atomic), is flushed to disk with fsync, and is then
 * renamed over the target; finally the directory entry is flushed too.
 *
 * replaceIfUnchanged does the same for the live server's write-back, but only
 * over the version the page loaded: an editor's save is never overwritten.
 */
import { closeSync, existsSync, fsyncSync, linkSync, openSync, readdirSync, renameSync, statSync, unlinkSync, writeSync } from 'node:fs';
import { readDocumentBytesSync } from '../document.js';
import { randomBytes } from 'node:crypto';
import { basename, dirname, join } from 'node:path';

const TEMP = /^\.(.+)\.vaultbook-(\d+)-[0-9a-f]+\.(tmp|prev)$/;

/** The temporary name used while writing `file` (`.prev`: the version moved aside while it is judged). */
function tempNameFor(file: string, kind: 'tmp' | 'prev' = 'tmp'): string {
  return join(dirname(file), `.${basename(file)}.vaultbook-${process.pid}-${randomBytes(4).toString('hex')}.${kind}`);
}

/** Writes a new file with these bytes and flushes it; returns its path. */
function writeTemp(file: string, bytes: Buffer, mode: number): string {
  const temp = tempNameFor(file);
  const fd = openSync(temp, 'wx', mode);
  try {
    for (let at = 0; at < bytes.length;) at += writeSync(fd, bytes, at, bytes.length - at);
    fsyncSync(fd);
  } catch (e) {
    closeSync(fd);
    unlinkSync(temp);
    throw e;
  }
  closeSync(fd);
  return temp;
}

function syncFolder(file: string): void {
  // Flush the rename itself; not every platform lets a directory be opened, which is fine.
  try {
    const dir = openSync(dirname(file), 'r');
    try { fsyncSync(dir); } finally { closeSync(dir); }
  } catch {
    // best effort
  }
}

function unlinkQuietly(path: string): void {
  try { unlinkSync(path); } catch { /* already gone */ }
}

/**
 * Writes `data` to `file` atomically (temp file + fsync + rename), keeping the file's permission bits.
 * @param file the target path; its directory must exist
 * @param data the complete new contents
 * @example writeFileAtomic('calc.md', Buffer.from(text, 'utf8'))
 */
export function writeFileAtomic(file: string, data: Buffer | string): void {
  const bytes = typeof data === 'string' ? Buffer.from(data, 'utf8') : data;
  let mode = 0o644;
  try {
    mode = statSync(file).mode & 0o777;
  } catch {
    // A new file gets the usual permissions.
  }
  const temp = writeTemp(file, bytes, mode);
  try {
    renameSync(temp, file);
  } catch (e) {
    unlinkSync(temp);
    throw e;
  }
  syncFolder(file);
}

/**
 * Replaces `file` with `data`, but only if the file still holds the expected version; an editor's
 * save that lands at any moment is kept, never overwritten.
 *
 * The new bytes are written and flushed to a temporary file first, so the moment of replacing is
 * a handful of system calls. Then, rather than renaming over the file (which would destroy a
 * version saved in the instant between a last look and the rename), the current file is renamed
 * aside, where its bytes are judged at leisure: nothing can change which version that is. The new
 * file is put in place with link(), which refuses if an editor created the file meanwhile. Last,
 * the version set aside is judged again, in case an editor that had it open wrote into it during
 * those instants; then its bytes are put back. For a few microseconds the file's name is absent;
 * editors and the watcher see that as a save in progress.
 *
 * @param isExpected judges the bytes found on disk (the server compares their version)
 * @returns 'replaced', or 'changed' when the file was not the expected version (it is left as found)
 * @example replaceIfUnchanged('calc.md', bytes, (b) => versionOf(b) === pageVersion)
 */
export function replaceIfUnchanged(file: string, data: Buffer, isExpected: (bytes: Buffer) => boolean): 'replaced' | 'changed' {
  const mode = statSync(file).mode & 0o777;
  const temp = writeTemp(file, data, mode);
  const aside = tempNameFor(file, 'prev');
  // One look before the window, so an obviously stale write does not move the file at all.
  if (!isExpected(readDocumentBytesSync(file))) {
    unlinkQuietly(temp);
    return 'changed';
  }
  try {
    renameSync(file, aside);
  } catch (e) {
    unlinkQuietly(temp);
    if ((e as NodeJS.ErrnoException).code === 'ENOENT') return 'changed';
    throw e;
  }
  const putBack = () => {
    // link() never replaces: if an editor saved a new file meanwhile, theirs stays and ours goes.
    try { linkSync(aside, file); } catch { /* a newer file is in place */ }
    unlinkQuietly(aside);
  };
  let before: Buffer;
  try {
    before = readDocumentBytesSync(aside);
  } catch (e) {
    putBack();
    unlinkQuietly(temp);
    throw e;
  }
  if (!isExpected(before)) {
    putBack();
    unlinkQuietly(temp);
    return 'changed';
  }
  try {
    linkSync(temp, file);
  } catch (e) {
    unlinkQuietly(temp);
    // EEXIST: an editor saved while the file was aside; its save is the newest version.
    if ((e as NodeJS.ErrnoException).code === 'EEXIST') { unlinkQuietly(aside); return 'changed'; }
    putBack();
    throw e;
  }
  unlinkQuietly(temp);
  // Did a writer holding the old file open change it while it was aside? Then its bytes win.
  if (!readDocumentBytesSync(aside).equals(before)) {
    renameSync(aside, file);
    syncFolder(file);
    return 'changed';
  }
  unlinkQuietly(aside);
  syncFolder(file);
  return 'replaced';
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Removes temporary files a killed writer left beside `file` (its process no longer runs). A
 * version it had moved aside is put back when the file itself is missing.
 * @returns the names removed
 */
export function removeStaleTemps(file: string): string[] {
  const removed: string[] = [];
  for (const name of readdirSync(dirname(file))) {
    const m = TEMP.exec(name);
    if (!m || m[1] !== basename(file) || isAlive(Number(m[2]))) continue;
    try {
      if (m[3] === 'prev' && !existsSync(file)) {
        linkSync(join(dirname(file), name), file);
      }
      unlinkSync(join(dirname(file), name));
      removed.push(name);
    } catch {
      // Someone else removed it first.
    }
  }
  return removed;
}
