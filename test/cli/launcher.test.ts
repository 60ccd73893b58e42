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
import { ensureBundle } from '../../bin/bundle.js';

const root = fileURLToPath(new URL('../../', import.meta.url));
const cli = (args: string[], env: Record<string, string> = {}) =>
  spawnSync(process.execPath, [join(root, 'bin/vaultbook.js'), ...args], { cwd: tmpdir(), encoding: 'utf8', env: { ...process.env, ...env }, maxBuffer: 8e6, timeout: 120_000 });

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
