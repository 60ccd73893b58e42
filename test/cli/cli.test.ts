import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { main } from '../../bin/cli.js';

let dir = '';
const write = (name: string, text: string) => { const p = join(dir, name); writeFileSync(p, text); return p; };

async function run(...argv: string[]) {
  const out: string[] = [];
  const err: string[] = [];
  const code = await main(argv, (s) => out.push(s), (s) => err.push(s));
  return { code, out: out.join('\n'), err: err.join('\n') };
}

const PASSING = ['---', 'title: Fictional lintel check', 'project: Hill College (fictional)', '---', '',
  '```given', 'L = 6.4 m  # clear span [3 m, 12 m]', 'w = 10 kN/m  # line load', '```', '',
  '```calc', 'M = w * L^2 / 8 to kN m  # mid-span moment, simply supported', 'R = w * L / 2', '```', '',
  '```check', 'c_M = M <= 60 kN m  # moment capacity', 'R < 40 kN', '```', ''].join('\n');

beforeAll(() => { dir = mkdtempSync(join(tmpdir(), 'vaultbook-cli-')); });

describe('vaultbook eval', () => {
  it('eval FILE --json follows the documented contract', async () => {
    const file = write('pass.md', PASSING);
    const r = await run('eval', file, '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(Object.keys(j)).toEqual(['file', 'meta', 'values', 'checks', 'diagnostics']);
    expect(j.meta).toEqual({ title: 'Fictional lintel check', project: 'Hill College (fictional)' });
    // wL²/8 = 10 · 6.4² / 8 = 51.2 kN m (simply supported beam, any statics text)
    expect(j.values.M).toEqual({ value: 51.2, unit: 'kN m', text: '51.2 kN m', kind: 'calc', line: 12 });
    expect(j.values.L).toEqual({ value: 6.4, unit: 'm', text: '6.4 m', kind: 'given', line: 7 });
    expect(j.values.c_M).toMatchObject({ value: true, kind: 'check', line: 17 });
    expect(j.checks).toEqual([
      { name: 'c_M', source: 'M <= 60 kN m', description: 'moment capacity', line: 17, pass: true, utilization: expect.closeTo(51.2 / 60, 12) },
      { name: null, source: 'R < 40 kN', description: '', line: 18, pass: true, utilization: null },
    ]);
    expect(j.diagnostics).toEqual([]);
  });

  it('eval FILE prints a table', async () => {
    const r = await run('eval', write('pass2.md', PASSING));
    expect(r.out).toMatch(/12\s+calc\s+M\s+51\.2 kN m/);
  });

  it('--set overrides a given input and marks it', async () => {
    const r = await run('eval', write('set.md', PASSING), '--set', 'L=8 m', '--json');
    const j = JSON.parse(r.out);
    expect(j.values.M.value).toBeCloseTo(80, 10);
    expect(j.values.L).toMatchObject({ value: 8, overridden_from: '6.4 m' });
  });

  it('--set on a name that is not a given input is an error (exit 2)', async () => {
    const r = await run('eval', write('set2.md', PASSING), '--set', 'M=3 kN m', '--json');
    expect(r.code).toBe(2);
    expect(JSON.parse(r.out).diagnostics[0]).toMatchObject({ severity: 'error', message: expect.stringMatching(/"M" is not a given input/) });
  });

  it('a malformed --set is a usage error', async () => {
    const r = await run('eval', write('set3.md', PASSING), '--set', 'L');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--set expects NAME=EXPR/);
  });
});

describe('vaultbook check — exit codes', () => {
  it('exits 0 when every check holds', async () => {
    const r = await run('check', write('ok.md', PASSING));
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/2 checks, 2 hold, 0 fail; 0 errors/);
  });
  it('exits 1 when a check fails', async () => {
    const r = await run('check', write('fail.md', PASSING), '--set', 'w=20 kN/m');
    expect(r.code).toBe(1);
    expect(r.out).toMatch(/FAILS/);
  });
  it('exits 2 on an error diagnostic', async () => {
    const r = await run('check', write('err.md', PASSING.replace('R = w * L / 2', 'R = w + L')));
    expect(r.code).toBe(2);
  });
  it('exits 2 on an unreadable file, without crashing', async () => {
    const r = await run('check', join(dir, 'missing.md'), '--json');
    expect(r.code).toBe(2);
    expect(JSON.parse(r.out).diagnostics[0]).toMatchObject({ message: expect.stringMatching(/cannot read .*no such file/) });
  });
  it('exits 2 on an unknown command', async () => {
    expect((await run('frobnicate')).code).toBe(2);
  });
});
