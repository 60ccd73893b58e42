import { describe, it, expect } from 'vitest';
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { build, createLogger } from 'vite';
import { siteConfig } from '../../bin/serve/site-config.js';

describe('the live sheet bundle', () => {
  it('vite build bundles the page with the engine, cells and renderer, and no Node module', { timeout: 180_000 }, async () => {
    const outDir = mkdtempSync(join(tmpdir(), 'vaultbook-site-build-'));
    const warnings: string[] = [];
    const logger = createLogger('warn');
    logger.warn = (msg) => { warnings.push(msg); };
    logger.warnOnce = (msg) => { warnings.push(msg); };
    try {
      const base = siteConfig();
      await build({ ...base, configFile: false, customLogger: logger, logLevel: 'warn', build: { ...base.build, outDir, emptyOutDir: true, sourcemap: false } });
      const assets = readdirSync(join(outDir, 'assets'));
      const js = assets.filter((f) => f.endsWith('.js')).map((f) => readFileSync(join(outDir, 'assets', f), 'utf8')).join('\n');
      // The engine, the cell library and the renderer are in the bundle.
      for (const marker of ['compile: expected source to be a string', 'renderSheet: expected states to be a Map', 'arch_limit']) expect(js).toContain(marker);
      expect(warnings.filter((w) => /externalized for browser compatibility|node:/.test(w))).toEqual([]);
      console.log(`site bundle: ${assets.length} files, ${(js.length / 1e6).toFixed(2)} MB of JavaScript; warnings: ${warnings.length ? warnings.map((w) => w.split('\n')[0]).join(' | ') : 'none'}`);
    } finally {
      rmSync(outDir, { recursive: true, force: true });
    }
  });
});
