/**
 * The launcher (bin/vaultbook.js) and its command bundle (bin/bundle.js), run as a user runs
 * them: a fresh `node bin/vaultbook.js` process. The bundle must behave exactly as the sources
 * do under tsx (VAULTBOOK_NO_BUNDLE=1).
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { asciiOnly, ensureBundle, routeImports } from '../../bin/bundle.js';

const root = fileURLToPath(new URL('../../', import.meta.url));
const cli = (args: string[], env: Record<string, string> = {}) => {
  const r = spawnSync(process.execPath, [join(root, 'bin/vaultbook.js'), ...args], { cwd: tmpdir(), encoding: 'utf8', env: { ...process.env, ...env }, maxBuffer: 8e6, timeout: 120_000 });
  // A launcher that fell back to the TypeScript sources would pass every test below unnoticed.
  if (!env.VAULTBOOK_NO_BUNDLE) expect(r.stderr).not.toContain('running without the command bundle');
  return r;
};

describe('building the bundle', () => {
  // Each snippet is run before and after asciiOnly; the answers must be the same (ECMAScript's
  // rules for \\u escapes in regular expressions, with and without the u flag).
  it.each([
    ['/[\u00ee\u00ef]/.test("\u00ef")', 'a character class'],
    ['/^\u2212/.test("\u22125")', 'a plain character'],
    ['/\\\u00e9/.test("\u00e9")', 'an identity escape (the backslash goes with it)'],
    ['/\\\\\u00e9/.test("\\\\\u00e9")', 'an escaped backslash before the character (it stays)'],
    ['/[\ud83d\ude00]/u.test("\ud83d\ude00")', 'a character outside the BMP, u flag'],
    ['/^.$/u.test("\ud83d\ude00")', 'u flag, one code point'],
  ])('asciiOnly keeps the meaning of %s (%s)', (escaped) => {
    // The snippet as it would stand in a bundle, with the characters themselves.
    const raw = escaped.replace(/\\u([0-9a-f]{4})/g, (_, h: string) => String.fromCharCode(parseInt(h, 16)));
    const ascii = asciiOnly(raw);
    expect(/[^\x00-\x7f]/.test(ascii)).toBe(false);
    expect((0, eval)(ascii)).toBe((0, eval)(raw));
    expect((0, eval)(raw)).toBe(true);
  });

  it('routeImports sends import() of vite and playwright-core to the importer and refuses any other import()', () => {
    expect(routeImports('a=await import("vite");b=await import("playwright-core")')).toBe('a=await __vaultbookImport("vite");b=await __vaultbookImport("playwright-core")');
    expect(routeImports('x=["import(functions)"]')).toBe('x=["import(functions)"]');
    expect(() => routeImports('m=await import(name)')).toThrow(/keeps an import\(\)/);
  });
});

describe('the command bundle', () => {
  let dir: string;
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'vaultbook-launcher-'));
    await ensureBundle();
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('is plain ASCII, so Node reads it without decoding UTF-8 into a two-byte string', async () => {
    const entry = await ensureBundle();
    const folder = join(entry, '..');
    for (const f of readdirSync(folder).filter((n) => n.endsWith('.cjs'))) expect(/[^\x00-\x7f]/.test(readFileSync(join(folder, f), 'latin1'))).toBe(false);
  });

  it('`new` lists the templates from any folder (files found beside the sources, not beside the bundle)', () => {
    const r = cli(['new']);
    expect(r.status).toBe(0);
    for (const name of ['arch-ring', 'barrel-vault', 'buttress', 'cross-vault']) expect(r.stdout).toMatch(new RegExp(`^${name}\\s`, 'm'));
  });

  it('render gives byte-for-byte the sheet the sources give', { timeout: 180_000 }, () => {
    const fromBundle = join(dir, 'bundle.html'), fromSources = join(dir, 'sources.html');
    const file = join(root, 'templates', 'cross-vault.md');
    expect(cli(['render', file, '-o', fromBundle]).status).toBe(0);
    expect(cli(['render', file, '-o', fromSources], { VAULTBOOK_NO_BUNDLE: '1' }).status).toBe(0);
    expect(readFileSync(fromBundle, 'utf8')).toBe(readFileSync(fromSources, 'utf8'));
  });

  it('check over many files starts its worker threads from the bundle (no note that they could not start)', { timeout: 180_000 }, () => {
    const source = readFileSync(join(root, 'templates', 'buttress.md'), 'utf8');
    for (let i = 0; i < 120; i++) writeFileSync(join(dir, `calc-${String(i).padStart(3, '0')}.md`), source);
    const r = cli(['check', join(dir, 'calc-*.md'), '--jobs', '2']);
    expect(r.stderr).not.toMatch(/could not start/);
    expect(r.stdout).toMatch(/^120 files: /m);
    expect(r.status).toBe(0);
  });

  it('packages outside the bundle still load once the code cache is in use: render, then render --pdf twice (playwright-core)', { timeout: 240_000 }, () => {
    const file = join(root, 'templates', 'arch-ring.md');
    expect(cli(['render', file, '-o', join(dir, 'plain.html')]).status).toBe(0);
    for (const n of [1, 2]) {
      const r = cli(['render', file, '--pdf', join(dir, `sheet-${n}.pdf`)]);
      expect(r.stderr).toBe('');
      expect(r.status).toBe(0);
      expect(readFileSync(join(dir, `sheet-${n}.pdf`)).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    }
  });
});
