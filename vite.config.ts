/**
 * Vite configuration for the live sheet (site/). `vaultbook serve` uses
 * siteConfig() with its own server options; `npx vite build` uses this file
 * to bundle the app (a check that engine/ and cells/ are browser-safe).
 */
import { defineConfig } from 'vite';
import { siteConfig } from './bin/serve/site-config.js';

export { siteConfig, REPO_ROOT } from './bin/serve/site-config.js';
export default defineConfig(siteConfig());
