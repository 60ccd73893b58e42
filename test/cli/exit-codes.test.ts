/**
 * One family of exit codes for every command (README, "Exit codes, pipes and limits"): 2 whenever
 * there is an error diagnostic, 1 only for a gate that failed (check, diff), 0 otherwise; and every
 * command ends quietly when the reader of its output closes the pipe.
 *
 * The calcs are fictional: a lintel of an invented college, M = wL²/8 (simply supported beam,
 * any statics text).
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { main } from '../../bin/cli.js';
import { makeNewCommand, TEMPLATE_DIR } from '../../bin/commands/new.js';

const REPO = join(import.meta.dirname, '..', '..');
const CLI = join(REPO, 'bin', 'vaultbook.js');

const calc = (load: string, extra = '') => ['---', 'title: Fictional lintel check', '---', '',
  '```given', 'L = 6.4 m  # clear span', `w = ${load}  # line load`, '```', '',
  '```calc', 'M = w * L^2 / 8 to kN m  # mid-span moment', extra, '```', '',
  '```check', 'c_M = M <= 60 kN m  # moment capacity', '```', ''].join('\n');

let dir = '';
let holds = '', fails = '', broken = '';
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'vaultbook-exit-'));
  holds = join(dir, 'holds.md');
  fails = join(dir, 'fails.md');
  broken = join(dir, 'broken.md');
  writeFileSync(holds, calc('10 kN/m')); // M = 51.2 kN m ≤ 60
  writeFileSync(fails, calc('20 kN/m')); // M = 102.4 kN m > 60
  writeFileSync(broken, calc('10 kN/m', 'R = w + L  # adds a load to a length'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function code(...argv: string[]): Promise<number> {
  return main(argv, () => {}, () => {});
}

describe('exit codes', () => {
  it('eval: 0 with values, 0 when a check fails (eval judges nothing), 2 with an error diagnostic', async () => {
    expect(await code('eval', holds)).toBe(0);
    expect(await code('eval', fails)).toBe(0);
    expect(await code('eval', broken)).toBe(2);
    expect(await code('eval', broken, '--json')).toBe(2);
  });

  it('check: 0 all hold, 1 a check fails, 2 an error', async () => {
    expect(await code('check', holds)).toBe(0);
    expect(await code('check', fails)).toBe(1);
    expect(await code('check', broken)).toBe(2);
  });

  it('render: 0 when the sheet is written, failing checks included; 2 with an error (sheet still written)', async () => {
    expect(await code('render', holds, '-o', join(dir, 'h.html'))).toBe(0);
    expect(await code('render', fails, '-o', join(dir, 'f.html'))).toBe(0);
    expect(existsSync(join(dir, 'f.html'))).toBe(true);
    expect(await code('render', broken, '-o', join(dir, 'b.html'))).toBe(2);
    expect(existsSync(join(dir, 'b.html'))).toBe(true);
  });

  it('render of a document over the size limit: 2, no sheet, and the message names the limit (not "no cells found")', async () => {
    // A 5 MB calc (issue: large documents fail with a plain message in the user's words).
    const big = join(dir, 'big5.md');
    const block = ['```given', ...Array.from({ length: 50 }, (_, k) => `a_${k} = ${k + 1} m  # input ${k}`), '```', ''].join('\n');
    writeFileSync(big, block.repeat(Math.ceil(5_000_000 / block.length)));
    const errs: string[] = [];
    expect(await main(['render', big, '-o', join(dir, 'big5.html')], () => {}, (s) => errs.push(s))).toBe(2);
    expect(existsSync(join(dir, 'big5.html'))).toBe(false);
    expect(errs.join('\n')).toMatch(/a calc document may have at most 1,000,000/);
    expect(errs.join('\n')).not.toMatch(/no cells found/);
  });

  it('diff: 0 nothing newly fails, 1 a check newly fails, 2 the new version has errors', async () => {
    expect(await code('diff', holds, holds)).toBe(0);
    expect(await code('diff', fails, holds)).toBe(0);
    expect(await code('diff', holds, fails)).toBe(1);
    expect(await code('diff', holds, broken)).toBe(2);
  });

  it('new: 0 creates, 2 for an existing file or an unknown template; serve: 2 for a file it refuses', async () => {
    const make = makeNewCommand(TEMPLATE_DIR);
    const quiet = () => {};
    expect(await make(['barrel-vault', join(dir, 'new.md')], quiet, quiet)).toBe(0);
    expect(await make(['barrel-vault', join(dir, 'new.md')], quiet, quiet)).toBe(2);
    expect(await make(['no-such-template', join(dir, 'other.md')], quiet, quiet)).toBe(2);
    expect(await code('serve', join(dir, 'missing.md'))).toBe(2);
  });
});

/**
 * Runs the real command with its stdout on a pipe whose reader goes away after `keep` bytes
 * (0: before the command writes anything), as `| head -c keep` does.
 */
function withClosingReader(args: string[], keep: number): Promise<{ status: number | null; signal: NodeJS.Signals | null; stderr: string; got: number }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [CLI, ...args], { stdio: ['ignore', 'pipe', 'pipe'], cwd: dir });
    let stderr = '';
    let got = 0;
    child.stderr.setEncoding('utf8').on('data', (s: string) => { stderr += s; });
    const close = () => child.stdout.destroy();
    if (keep === 0) close();
    else child.stdout.on('data', (b: Buffer) => { got += b.length; if (got >= keep) close(); });
    child.on('close', (status, signal) => resolve({ status, signal, stderr, got }));
  });
}

describe('a reader that closes the pipe early', () => {
  // Output far larger than a pipe's buffer (64 kB), so the command is still writing when the reader goes.
  let big = '';
  beforeAll(() => {
    big = join(dir, 'big.md');
    const bays = Array.from({ length: 400 }, (_, i) => `M_${i} = ${10 + (i % 7)} kN/m * (${4 + (i % 5)} m)^2 / 8 to kN m  # bay ${i} (fictional)`);
    const checks = Array.from({ length: 400 }, (_, i) => `M_${i} <= 200 kN m  # bay ${i}`);
    writeFileSync(big, `# Many bays (fictional)\n\n\`\`\`calc\n${bays.join('\n')}\n\`\`\`\n\n\`\`\`check\n${checks.join('\n')}\n\`\`\`\n`);
  });

  // Every bay holds: the largest moment is 16 kN/m · (8 m)² / 8 = 128 kN m ≤ 200 kN m.
  for (const [label, args, exit] of [
    ['eval FILE', ['eval', 'big.md'], 0],
    ['check --json FILE', ['check', '--json', 'big.md'], 0],
    ['diff --json OLD NEW', ['diff', '--json', 'fails.md', 'big.md'], 0],
    ['render -o - FILE', ['render', '-o', '-', 'big.md'], 0],
  ] as const) {
    it(`${label} | head ends quietly, with its own exit code and no stack trace`, { timeout: 180_000 }, async () => {
      for (const keep of [0, 200]) {
        const r = await withClosingReader([...args], keep);
        expect({ status: r.status, signal: r.signal }, `${label} keep ${keep}: ${r.stderr}`).toEqual({ status: exit, signal: null });
        expect(r.stderr, `${label} keep ${keep}`).not.toMatch(/EPIPE|Unhandled|\n\s+at /);
      }
    });
  }

  it('a real shell pipe: vaultbook eval big.md | head -2 prints two lines and nothing on stderr', { timeout: 180_000 }, async () => {
    const r = await new Promise<{ out: string; err: string; status: number | null }>((resolve) => {
      const child = spawn('bash', ['-o', 'pipefail', '-c', `"${process.execPath}" "${CLI}" eval big.md | head -2`], { cwd: dir });
      let out = '', err = '';
      child.stdout.setEncoding('utf8').on('data', (s: string) => { out += s; });
      child.stderr.setEncoding('utf8').on('data', (s: string) => { err += s; });
      child.on('close', (status) => resolve({ out, err, status }));
    });
    expect(r.out.trimEnd().split('\n')).toHaveLength(2);
    expect(r.out).toMatch(/^line\s+kind\s+name\s+value/);
    expect(r.err).toBe('');
    expect(r.status).toBe(0);
  });
});
