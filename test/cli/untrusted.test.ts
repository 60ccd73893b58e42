/**
 * Opening a stranger's calc: files that are not regular files or not text, a hostile git
 * repository around the document, and revisions that try to be options. Everything here runs in
 * temp folders; the documents are fictional.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { execFileSync, spawnSync } from 'node:child_process';
import { chmodSync, copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, symlinkSync, truncateSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { main } from '../../bin/cli.js';
import { makeNewCommand } from '../../bin/commands/new.js';
import { MAX_DOCUMENT_BYTES, readDocument } from '../../bin/document.js';
import { archiveInfo, revisionProblem } from '../../bin/git.js';
import { startServer } from '../../bin/serve/server.js';
import { rawRequest } from '../serve/helpers.js';

const REPO = join(import.meta.dirname, '..', '..');
const TEMPLATE = join(REPO, 'templates', 'barrel-vault.md');

let dir = '';
beforeAll(() => { dir = mkdtempSync(join(tmpdir(), 'vaultbook-untrusted-')); });
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function run(...argv: string[]) {
  const out: string[] = [];
  const err: string[] = [];
  const code = await main(argv, (s) => out.push(s), (s) => err.push(s));
  return { code, out: out.join('\n'), err: err.join('\n') };
}

describe('documents that are not regular files, too large, or not text', () => {
  let fifo = '', urandom = '', folder = '', large = '', nul = '', latin1 = '', empty = '', prose = '';
  beforeAll(() => {
    fifo = join(dir, 'pipe.md');
    execFileSync('mkfifo', [fifo]);
    urandom = join(dir, 'random.md');
    symlinkSync('/dev/urandom', urandom);
    folder = join(dir, 'folder.md');
    mkdirSync(folder);
    large = join(dir, 'large.md');
    writeFileSync(large, '');
    truncateSync(large, MAX_DOCUMENT_BYTES + 1); // sparse: no disk used
    nul = join(dir, 'nul.md');
    writeFileSync(nul, '# Fictional\n\n```calc\nx = 1 m\0\n```\n');
    latin1 = join(dir, 'latin1.md');
    writeFileSync(latin1, Buffer.concat([Buffer.from('# L\u00e4nge\n```calc\nx = 1 m # '), Buffer.from([0xe4]), Buffer.from('\n```\n')]));
    empty = join(dir, 'empty.md');
    writeFileSync(empty, '');
    prose = join(dir, 'prose.md');
    writeFileSync(prose, '---\ntitle: Only words (fictional)\n---\n# A heading\n\nSome prose and `code`, no cells.\n\n```js\nx = 1\n```\n');
  });

  it('readDocument refuses a FIFO, a device, a folder and a file over the limit at once, in plain words', async () => {
    await expect(readDocument(fifo)).rejects.toThrow(/pipe\.md: it is a named pipe \(FIFO\), not a regular file/);
    await expect(readDocument(urandom)).rejects.toThrow(/random\.md: it is a device, not a regular file/);
    await expect(readDocument(folder)).rejects.toThrow(/folder\.md: it is a folder, not a file/);
    await expect(readDocument(large)).rejects.toThrow(/large\.md: it is 10\.0 MB, larger than the 10 MB limit for a calc document/);
  });

  it('readDocument locates the first NUL byte and the first byte that is not UTF-8', async () => {
    await expect(readDocument(nul)).rejects.toMatchObject({ ruleId: 'io/not-text', line: 4, column: 8, message: expect.stringMatching(/not a text file: a NUL byte at line 4, column 8/) });
    await expect(readDocument(latin1)).rejects.toMatchObject({ ruleId: 'io/not-text', line: 3, column: 11, message: expect.stringMatching(/byte 0xe4 \(not UTF-8\) at line 3, column 11/) });
    // A Greek letter and a byte order mark are text.
    writeFileSync(join(dir, 'greek.md'), '\ufeff```calc\n\u03b3 = 18 kN/m^3\n```\n');
    expect((await readDocument(join(dir, 'greek.md'))).text).toContain('\u03b3 = 18');
  });

  for (const command of ['eval', 'check', 'render'] as const) {
    it(`${command} refuses each of them with exit 2 and a located error, writing no sheet`, async () => {
      for (const [file, message] of [
        [fifo, /pipe\.md:1:1 {2}error: cannot read .*pipe\.md: it is a named pipe/],
        [urandom, /random\.md:1:1 {2}error: cannot read .*: it is a device/],
        [large, /larger than the 10 MB limit/],
        [nul, /nul\.md:4:8 {2}error: not a text file: a NUL byte/],
        [latin1, /latin1\.md:3:11 {2}error: not a text file/],
        [empty, /empty\.md:1:1 {2}error: no cells found/],
        [prose, /prose\.md:1:1 {2}error: no cells found/],
      ] as const) {
        const r = await run(command, file, ...(command === 'render' ? ['-o', join(dir, 'sheet.html')] : []));
        expect(r.code, `${command} ${file}`).toBe(2);
        expect(`${r.out}\n${r.err}`, `${command} ${file}`).toMatch(message);
      }
      expect(existsSync(join(dir, 'sheet.html'))).toBe(false);
    });
  }

  it('check --json keeps the contract for a refused file: one error diagnostic with its rule', async () => {
    const r = await run('check', nul, '--json');
    expect(JSON.parse(r.out).diagnostics).toEqual([expect.objectContaining({ severity: 'error', ruleId: 'io/not-text', line: 4, column: 8 })]);
    const e = await run('eval', empty, '--json');
    expect(JSON.parse(e.out).diagnostics).toEqual([expect.objectContaining({ severity: 'error', ruleId: 'doc/no-cells' })]);
  });

  it('check GLOB over a folder holding a FIFO and a link to /dev/urandom finishes, reporting both', async () => {
    // A FIFO itself is no file to a glob; a .md link to it is one, and is refused when read.
    symlinkSync(fifo, join(dir, 'linked-pipe.md'));
    const r = await run('check', `${dir}/*.md`, '--json', '--jobs', '1');
    const byName = new Map((JSON.parse(r.out) as Array<{ file: string; diagnostics: Array<{ message: string }> }>).map((s) => [s.file.slice(dir.length + 1), s.diagnostics[0]?.message ?? '']));
    expect(byName.get('linked-pipe.md')).toMatch(/named pipe/);
    expect(byName.get('random.md')).toMatch(/device/);
    expect(r.code).toBe(2);
  }, 120_000);

  it('diff, serve and new refuse them too', async () => {
    const d = await run('diff', TEMPLATE, fifo);
    expect([d.code, d.err]).toEqual([2, expect.stringMatching(/pipe\.md: it is a named pipe/)]);
    const s = await run('serve', urandom, '--port', '0');
    expect([s.code, s.err]).toEqual([2, expect.stringMatching(/random\.md:1:1 {2}error: cannot read .*: it is a device/)]);
    await expect(startServer({ file: fifo, port: 0, logLevel: 'silent' })).rejects.toThrow(/named pipe/);
    // A templates folder whose template is a FIFO: listed without a title, refused when used.
    const templates = join(dir, 'templates');
    mkdirSync(templates);
    execFileSync('mkfifo', [join(templates, 'odd.md')]);
    const err: string[] = [];
    const out: string[] = [];
    const code = await makeNewCommand(templates)(['odd', join(dir, 'new.md')], (x) => out.push(x), (x) => err.push(x));
    expect([code, err.join('\n')]).toEqual([2, expect.stringMatching(/template odd: cannot read .*odd\.md: it is a named pipe/)]);
    expect(existsSync(join(dir, 'new.md'))).toBe(false);
  });
});

describe('a hostile git repository around the document', () => {
  let repo = '';
  let marker = '';
  let file = '';
  const git = (...args: string[]) => execFileSync('git', ['-c', 'user.name=t', '-c', 'user.email=t@example.invalid', '-c', 'commit.gpgsign=false', ...args], { cwd: repo, encoding: 'utf8' });

  beforeAll(() => {
    repo = join(dir, 'unpacked-archive');
    mkdirSync(repo);
    marker = join(dir, 'PROGRAM-RAN');
    file = join(repo, 'calc.md');
    copyFileSync(TEMPLATE, file);
    git('init', '-q');
    git('add', 'calc.md');
    git('commit', '-q', '-m', 'a fictional calc');
    // Every program the repository's config can name writes the marker when it runs.
    const evil = join(repo, 'evil.sh');
    writeFileSync(evil, `#!/bin/sh\necho "$0 $*" >> '${marker}'\n`);
    chmodSync(evil, 0o755);
    const hooks = join(repo, 'hooks');
    mkdirSync(hooks);
    for (const h of ['post-index-change', 'pre-commit', 'post-checkout', 'reference-transaction', 'fsmonitor-watchman']) copyFileSync(evil, join(hooks, h));
    for (const h of readdirSync(hooks)) chmodSync(join(hooks, h), 0o755);
    writeFileSync(join(repo, '.gitattributes'), '*.md filter=evil diff=evil merge=evil\n');
    for (const [k, v] of [
      ['core.fsmonitor', evil], ['core.hooksPath', hooks], ['filter.evil.clean', evil], ['filter.evil.smudge', evil],
      ['filter.evil.process', evil], ['diff.evil.textconv', evil], ['diff.evil.command', evil], ['diff.external', evil],
      ['merge.evil.driver', evil], ['core.pager', evil], ['pager.show', evil], ['log.showSignature', 'true'],
      ['gpg.program', evil], ['core.sshCommand', evil], ['core.editor', evil], ['credential.helper', `!${evil}`],
      ['core.askPass', evil],
    ]) git('config', k!, v!);
  });

  it('the repository is hostile: a plain `git status` in it runs its fsmonitor', () => {
    spawnSync('git', ['status', '--porcelain'], { cwd: repo, stdio: 'ignore' });
    expect(readFileSync(marker, 'utf8')).toContain('evil.sh');
    rmSync(marker);
  });

  it('archiveInfo, render, diff --rev and the live server read the commit without running anything', async () => {
    const head = git('rev-parse', 'HEAD').trim();
    expect(await archiveInfo(file, readFileSync(file))).toMatchObject({ commit: head, dirty: false });
    const r = await run('render', file, '-o', join(dir, 'hostile.html'));
    expect(r.code).toBe(0);
    expect(readFileSync(join(dir, 'hostile.html'), 'utf8')).toContain(head.slice(0, 12));
    const d = await run('diff', file, '--rev', 'HEAD', '--json');
    expect(d.code).toBe(0);
    const server = await startServer({ file, port: 0, logLevel: 'silent' });
    try {
      const doc = JSON.parse((await rawRequest(server.port, '/__doc')).body);
      expect(doc.archive).toMatchObject({ commit: head, dirty: false });
      const w = await rawRequest(server.port, '/__write', {
        method: 'POST', headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ version: doc.version, values: { t: '0.25 m' } }),
      });
      expect(JSON.parse(w.body)).toMatchObject({ ok: true, archive: { commit: head, dirty: true } });
    } finally {
      await server.close();
    }
    expect(existsSync(marker)).toBe(false);
  }, 120_000);
});

describe('diff --rev never lets git read a revision as an option', () => {
  it('revisionProblem refuses a leading "-", spaces and control characters', () => {
    expect(revisionProblem('--output=out.txt')).toMatch(/starts with "-"/);
    expect(revisionProblem('-1')).toMatch(/starts with "-"/);
    expect(revisionProblem('HEAD --output=x')).toMatch(/space or a control character/);
    expect(revisionProblem('')).toMatch(/empty/);
    expect(revisionProblem('HEAD~1')).toBeNull();
    expect(revisionProblem('v1.2^{commit}')).toBeNull();
  });

  it('vaultbook diff calc.md --rev=--output=out.txt is refused with exit 2, and git writes no file', async () => {
    const repo = join(dir, 'rev-repo');
    mkdirSync(repo);
    copyFileSync(TEMPLATE, join(repo, 'calc.md'));
    const git = (...args: string[]) => execFileSync('git', ['-c', 'user.name=t', '-c', 'user.email=t@example.invalid', '-c', 'commit.gpgsign=false', ...args], { cwd: repo });
    git('init', '-q');
    git('add', 'calc.md');
    git('commit', '-q', '-m', 'calc');
    for (const rev of ['--output=out.txt', '--output', '-o']) {
      const r = await run('diff', join(repo, 'calc.md'), `--rev=${rev}`);
      expect(r.code, rev).toBe(2);
      expect(r.err, rev).toMatch(/--rev: "-[^"]*" starts with "-"; a revision never does/);
    }
    // Through the real command line too, from inside the repository.
    const p = spawnSync(process.execPath, [join(REPO, 'bin', 'vaultbook.js'), 'diff', 'calc.md', '--rev=--output=out.txt'], { cwd: repo, encoding: 'utf8', env: { ...process.env, VAULTBOOK_NO_BUNDLE: '1' } });
    expect(p.status).toBe(2);
    expect(p.stderr).toMatch(/starts with "-"/);
    expect(readdirSync(repo).sort()).toEqual(['.git', 'calc.md']);
  }, 120_000);
});
