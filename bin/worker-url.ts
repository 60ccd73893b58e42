/**
 * workerUrl: where a worker's code is (a thread's or a child process's). Run from the sources (tsx, vitest), a worker starts
 * from a small .js entry beside its TypeScript that registers tsx first; run from the command
 * bundle, bin/bundle.js builds each worker as its own file and names the bundle's folder in
 * __VAULTBOOK_BUNDLE__.
 */
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';

/** Set by bin/bundle.js in the command bundle: the folder holding the bundled files. */
declare const __VAULTBOOK_BUNDLE__: string | undefined;

/**
 * @param bundled the worker's file in the bundle, e.g. 'archive-worker.cjs'
 * @param entry the .js entry to use from the sources
 * @example new Worker(workerUrl('typeset-worker.cjs', new URL('./worker-entry.js', import.meta.url)))
 */
export function workerUrl(bundled: string, entry: URL): URL {
  return typeof __VAULTBOOK_BUNDLE__ === 'string' ? pathToFileURL(join(__VAULTBOOK_BUNDLE__, bundled)) : entry;
}
