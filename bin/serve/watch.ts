/**
 * watchDocument: notices when the document changes on disk, whichever editor saved it.
 *
 * Editors save in different ways (write in place, or write a new file and
 * rename it over the old one), so the watch is on the document's folder,
 * filtered by name, with a stat poll as a fallback for file systems where
 * fs.watch is silent. Bursts of events are debounced, and a change is only
 * reported when the bytes' version differs from the last one seen.
 */
import { watch, statSync, type FSWatcher } from 'node:fs';
import { basename, dirname } from 'node:path';
import { versionOf } from './version.js';
import { readDocumentBytesSync } from '../document.js';

export interface DocumentWatch {
  /** Records a version the caller wrote itself, so it is not reported back. */
  known(version: string): void;
  close(): void;
}

export interface WatchOptions {
  /** Quiet time before a burst of events is read, ms (default 60). */
  debounceMs?: number;
  /** Stat poll interval, ms (default 300). */
  pollMs?: number;
  /** false: poll only (as on file systems where fs.watch is silent). Default true. */
  fsWatch?: boolean;
}

/**
 * Calls `onChange` with the new bytes and version each time the file's content changes.
 * @param file the document
 * @param initialVersion the version already loaded
 * @example const w = watchDocument('calc.md', v0, (bytes, v) => push(v)); … w.close()
 */
export function watchDocument(file: string, initialVersion: string, onChange: (bytes: Buffer, version: string) => void, options: WatchOptions = {}): DocumentWatch {
  const debounceMs = options.debounceMs ?? 60;
  const pollMs = options.pollMs ?? 300;
  const name = basename(file);
  let last = initialVersion;
  let timer: NodeJS.Timeout | null = null;
  let closed = false;
  let lastStat = '';

  const read = () => {
    timer = null;
    if (closed) return;
    let bytes: Buffer;
    try {
      // Only a regular file within the size limit: a save that swapped in a pipe must not block the server.
      bytes = readDocumentBytesSync(file);
    } catch {
      return; // Mid-save (deleted before being recreated), or not a document: the next event or poll reads it.
    }
    const version = versionOf(bytes);
    if (version === last) return;
    last = version;
    onChange(bytes, version);
  };
  const soon = () => {
    if (closed) return;
    if (timer) clearTimeout(timer);
    timer = setTimeout(read, debounceMs);
  };

  let watcher: FSWatcher | null = null;
  if (options.fsWatch !== false) try {
    watcher = watch(dirname(file), { persistent: false }, (_event, changed) => {
      if (changed === null || changed === name) soon();
    });
    watcher.on('error', () => { watcher?.close(); watcher = null; });
  } catch {
    watcher = null; // The poll below still sees changes.
  }
  const statKey = () => {
    try {
      const s = statSync(file, { bigint: true });
      return `${s.ino}:${s.size}:${s.mtimeNs}:${s.ctimeNs}`;
    } catch {
      return 'missing';
    }
  };
  lastStat = statKey();
  const poll = setInterval(() => {
    const key = statKey();
    if (key !== lastStat) {
      lastStat = key;
      soon();
    }
  }, pollMs);
  poll.unref();

  return {
    known: (version) => { last = version; },
    close: () => {
      closed = true;
      if (timer) clearTimeout(timer);
      clearInterval(poll);
      watcher?.close();
    },
  };
}
