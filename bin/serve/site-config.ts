/**
 * siteConfig: the Vite configuration of the live sheet's app (site/), without a document.
 *
 * It lives under bin/ (not in vite.config.ts alone) because the command line
 * may run from a bundle built from bin/, engine/ and cells/; the app folder
 * is therefore found by walking up from wherever this code runs, not from a
 * fixed relative path.
 */
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { UserConfig } from 'vite';

/** The folder holding package.json and site/index.html, found from `from` upwards. */
export function findRepoRoot(from: string): string {
  for (let dir = from; ; dir = dirname(dir)) {
    if (existsSync(join(dir, 'site', 'index.html')) && existsSync(join(dir, 'package.json'))) return dir;
    if (dirname(dir) === dir) throw new Error(`vaultbook serve: cannot find the app (site/index.html) in a folder above ${from}`);
  }
}

export const REPO_ROOT = findRepoRoot(dirname(fileURLToPath(import.meta.url)));

/**
 * The app's configuration: root, the folders it may serve, its dependencies.
 * @example createServer({...siteConfig(), configFile: false, server: {...siteConfig().server, port: 0}})
 */
export function siteConfig(): UserConfig {
  return {
    root: join(REPO_ROOT, 'site'),
    // One cache for every server; outside the app folder, so it is served only through /@fs/.
    cacheDir: join(REPO_ROOT, 'node_modules', '.vite-vaultbook'),
    publicDir: false,
    appType: 'mpa',
    clearScreen: false,
    optimizeDeps: {
      entries: ['index.html'],
      include: ['mathjs', 'marked', 'katex', '@observablehq/runtime', 'yaml', 'sanitize-html'],
    },
    server: {
      // No file watcher: a page that reloads itself because a source file changed would lose a
      // reviewer's trial values. The document is watched by the server itself (bin/serve/watch.ts).
      watch: null,
      fs: {
        strict: true,
        allow: [join(REPO_ROOT, 'site'), join(REPO_ROOT, 'engine'), join(REPO_ROOT, 'cells'), join(REPO_ROOT, 'node_modules')],
        deny: ['.env', '.env.*', '*.{crt,pem,key}', '**/.git/**'],
      },
    },
    // The evaluation worker (site/worker/) shares chunks with the page: an ES module worker.
    worker: { format: 'es' },
    build: {
      outDir: join(REPO_ROOT, 'dist', 'site'),
      emptyOutDir: true,
      target: 'es2022',
    },
  };
}
