/**
 * Vite configuration for the live sheet (site/). The engine and the cell
 * library are imported from outside the app folder and run in the browser.
 *
 * `vaultbook serve` uses siteConfig() with its own server options;
 * `npx vite build` uses the default export to bundle the app (a check that
 * engine/ and cells/ are browser-safe).
 */
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { defineConfig, type UserConfig } from 'vite';

export const REPO_ROOT = dirname(fileURLToPath(import.meta.url));

/** The app's configuration, without a document: root, allowed folders, dependencies. */
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
    build: {
      outDir: join(REPO_ROOT, 'dist', 'site'),
      emptyOutDir: true,
      target: 'es2022',
    },
  };
}

export default defineConfig(siteConfig());
