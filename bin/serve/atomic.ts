/**
 * writeFileAtomic: replace a file so that a reader (or a crash) sees either
 * the old bytes or the new bytes, never a mix.
 *
 * The new text goes to a temporary file in the same directory (same file
 * system, so rename is atomic), is flushed to disk with fsync, and is then
 * renamed over the target; finally the directory entry is flushed too.
 */
import { closeSync, fsyncSync, openSync, readdirSync, renameSync, statSync, unlinkSync, writeSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { basename, dirname, join } from 'node:path';

const TEMP = /^\.(.+)\.vaultbook-(\d+)-[0-9a-f]+\.tmp$/;

/** The temporary name used while writing `file`. */
function tempNameFor(file: string): string {
  return join(dirname(file), `.${basename(file)}.vaultbook-${process.pid}-${randomBytes(4).toString('hex')}.tmp`);
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
  try {
    renameSync(temp, file);
  } catch (e) {
    unlinkSync(temp);
    throw e;
  }
  // Flush the rename itself; not every platform lets a directory be opened, which is fine.
  try {
    const dir = openSync(dirname(file), 'r');
    try { fsyncSync(dir); } finally { closeSync(dir); }
  } catch {
    // best effort
  }
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
 * Removes temporary files a killed writer left beside `file` (its process no longer runs).
 * @returns the names removed
 */
export function removeStaleTemps(file: string): string[] {
  const removed: string[] = [];
  for (const name of readdirSync(dirname(file))) {
    const m = TEMP.exec(name);
    if (!m || m[1] !== basename(file) || isAlive(Number(m[2]))) continue;
    try {
      unlinkSync(join(dirname(file), name));
      removed.push(name);
    } catch {
      // Someone else removed it first.
    }
  }
  return removed;
}
