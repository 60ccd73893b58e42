/** `vaultbook render`: files written, exit codes, --set, archive identification, and the missing-Chromium message. */
import { afterEach, describe, expect, it } from 'vitest';
import { copyFileSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync, appendFileSync } from 'node:fs';
import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { main } from '../../../bin/cli.js';
import { archiveInfo, defaultHtmlPath } from '../../../bin/commands/render.js';

const fixtures = fileURLToPath(new URL('../../fixtures/sheets/', import.meta.url));
const root = fileURLToPath(new URL('../../../', import.meta.url));
const dirs: string[] = [];
function scratch(): string {
  const d = mkdtempSync(join(tmpdir(), 'vb-render-'));
  dirs.push(d);
  return d;
}
afterEach(() => { for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true }); });

async function run(args: string[]): Promise<{ code: number; out: string[] }> {
  const out: string[] = [];
  const code = await main(args, (s) => out.push(s), (s) => out.push(s));
  return { code, out };
}

describe('vaultbook render', () => {
  it('render FILE writes FILE.html beside it and exits 0 when a check fails (the sheet shows it)', async () => {
    const d = scratch();
    copyFileSync(join(fixtures, 'verdicts.md'), join(d, 'verdicts.md'));
    const { code, out } = await run(['render', join(d, 'verdicts.md')]);
    expect(code).toBe(0);
    expect(existsSync(join(d, 'verdicts.html'))).toBe(true);
    expect(out.join('\n')).toContain('6 checks: 4 hold, 2 fail');
    expect(defaultHtmlPath('a/b/calc.md')).toBe(join('a/b', 'calc.html'));
  });

  it('render -o OUT writes there, exits 0 when every check holds, and applies --set', async () => {
    const d = scratch();
    const out = join(d, 'sheet.html');
    const r = await run(['render', join(fixtures, 'cross-vault.md'), '-o', out, '--set', 'H_pier=70 kN']);
    expect(r.code).toBe(0);
    const html = readFileSync(out, 'utf8');
    expect(html).toContain('‡ set');
    expect(html).toContain('<code>H_pier</code> = <code>70 kN</code>');
  });

  it('render exits 2 for a sheet with errors, still writing it', async () => {
    const d = scratch();
    const out = join(d, 'e.html');
    const r = await run(['render', join(fixtures, 'errors.md'), '-o', out]);
    expect(r.code).toBe(2);
    expect(readFileSync(out, 'utf8')).toContain('THIS SHEET HAS 3 ERRORS');
  });

  it('render exits 2 with a clear message for a missing file or bad arguments', async () => {
    expect((await run(['render', '/nonexistent/x.md'])).code).toBe(2);
    expect((await run(['render'])).code).toBe(2);
    expect((await run(['render', 'a.md', '--set', 'nonsense'])).code).toBe(2);
  });

  it('render --pdf tells how to install Chromium when it is missing, and exits 2', async () => {
    const d = scratch();
    const before = process.env.VAULTBOOK_CHROMIUM;
    process.env.VAULTBOOK_CHROMIUM = '/nonexistent/chromium';
    let said = '';
    try {
      const r = await run(['render', join(fixtures, 'verdicts.md'), '--pdf', join(d, 'x.pdf')]);
      expect(r.code).toBe(2);
      said = r.out.join('\n');
    } finally {
      if (before === undefined) delete process.env.VAULTBOOK_CHROMIUM; else process.env.VAULTBOOK_CHROMIUM = before;
    }
    expect(said).toContain('apt-get install -y chromium');
    expect(existsSync(join(d, 'x.pdf'))).toBe(false);
  });

  it('archiveInfo gives the SHA-256 of the bytes, and the commit and dirty state inside a git repository', async () => {
    const d = scratch();
    const file = join(d, 'calc.md');
    writeFileSync(file, 'x = 1\n');
    expect(await archiveInfo(file, readFileSync(file))).toEqual({ hash: createHash('sha256').update('x = 1\n').digest('hex') });
    const git = (...a: string[]) => execFileSync('git', ['-C', d, '-c', 'user.name=t', '-c', 'user.email=t@example.invalid', ...a], { encoding: 'utf8' });
    git('init', '-q');
    git('add', 'calc.md');
    git('commit', '-q', '-m', 'calc');
    const head = git('rev-parse', 'HEAD').trim();
    expect(await archiveInfo(file, readFileSync(file))).toMatchObject({ commit: head, dirty: false });
    appendFileSync(file, 'y = 2\n');
    expect(await archiveInfo(file, readFileSync(file))).toMatchObject({ commit: head, dirty: true });
  });

  it('node bin/vaultbook.js render -o - runs from a cold process, the sheet on stdout and messages on stderr', () => {
    const r = spawnSync(process.execPath, [join(root, 'bin/vaultbook.js'), 'render', join(fixtures, 'verdicts.md'), '-o', '-'], { encoding: 'utf8', cwd: root, maxBuffer: 8e6 });
    expect(r.status).toBe(0);
    expect(r.stdout.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(r.stdout.trimEnd().endsWith('</html>')).toBe(true);
    expect(r.stderr).toContain('6 checks: 4 hold, 2 fail');
  }, 60_000);
});
