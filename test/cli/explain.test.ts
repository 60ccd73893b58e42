/**
 * `vaultbook explain`: the JSON contract, exit codes, and a kernel check's elasticity against a
 * finite difference this test computes itself through `check --set`.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { main } from '../../bin/cli.js';
import { fence } from '../helpers/settle.js';
import { explainOnThreads } from '../../bin/explain/threads.js';
import { explainDocument } from '../../engine/drivers/index.js';

let dir = '';
const write = (name: string, text: string) => { const p = join(dir, name); writeFileSync(p, text); return p; };

async function run(...argv: string[]) {
  const out: string[] = [];
  const err: string[] = [];
  const code = await main(argv, (s) => out.push(s), (s) => err.push(s));
  return { code, out: out.join('\n'), err: err.join('\n') };
}

// A fictional circular brick arch; the kernel finds its geometric factor of safety by limit analysis.
const ARCH = ['---', 'title: Fictional arch (explain test)', '---', '',
  fence('given', 'L = 4 m  # span', 'f = 1.2 m  # rise', 't = 0.3 m  # ring thickness', 'gamma = 18 kN/m^3  # brick masonry', 'w_q = 5 kN/m  # read by nothing'),
  fence('calc', 'r = arch_ring({shape: "circular", span: L, rise: f, thickness: t, unit_weight: gamma})', 'gsf = arch_limit(r).gsf'),
  fence('check', 'c_gsf = gsf >= 2  # geometric factor of safety'),
].join('\n');

beforeAll(() => { dir = mkdtempSync(join(tmpdir(), 'vaultbook-explain-')); });

describe('vaultbook explain', () => {
  it('explain FILE --json follows the documented contract and lists only the inputs a check depends on', async () => {
    const r = await run('explain', write('arch.md', ARCH), '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(Object.keys(j)).toEqual(['file', 'checks', 'diagnostics']);
    const c = j.checks[0];
    expect(Object.keys(c)).toEqual(['name', 'source', 'line', 'utilization', 'pass', 'case', 'inputs']);
    expect(c).toMatchObject({ name: 'c_gsf', line: 19, pass: true, case: null });
    expect(c.inputs.map((i: { name: string }) => i.name).sort()).toEqual(['L', 'f', 'gamma', 't']);
    expect(Object.keys(c.inputs[0]).slice(0, 6)).toEqual(['name', 'text', 'elasticity', 'u_minus', 'u_plus', 'kinked']);
    const t = c.inputs.find((i: { name: string }) => i.name === 't');
    expect(t.text).toBe('0.3 m');
  });

  it('explain agrees with a finite difference computed through check --set (kernel check c_gsf, input t)', async () => {
    const file = write('arch2.md', ARCH);
    const j = JSON.parse((await run('explain', file, 'c_gsf', '--json')).out);
    const t = j.checks[0].inputs.find((i: { name: string }) => i.name === 't');
    const u = async (value: string) => JSON.parse((await run('check', file, '--json', '--set', `t=${value}`)).out).checks[0].utilization as number;
    // A coarser step than explain's (±0.5 % against ±0.1 %): the same derivative, not the same arithmetic.
    const [down, up] = [await u('0.2985 m'), await u('0.3015 m')];
    const fd = (up - down) / (0.0015 * 2) * (0.3 / j.checks[0].utilization);
    expect(Math.abs(t.elasticity - fd)).toBeLessThan(0.02 * Math.abs(fd));
    // The swing is the check's utilization with t at 0.27 m and 0.33 m, exactly.
    expect(t.u_minus).toBeCloseTo(await u('0.27 m'), 9);
    expect(t.u_plus).toBeCloseTo(await u('0.33 m'), 9);
  });

  it('explain FILE prints each check with its inputs ranked, and a named value on request', async () => {
    const r = await run('explain', write('arch3.md', ARCH), 'c_gsf', 'gsf');
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/c_gsf: gsf >= 2 {2}\(line 19\) {2}utilization 0\.\d+, holds/);
    expect(r.out).toMatch(/\nt\s+0\.3 m\s+±10 %\s+−?\d/);
    expect(r.out).toMatch(/gsf = \d/);
    expect(r.out).not.toMatch(/\nw_q\s/);
  });

  it('explain exits 2 on an unknown check, a file that cannot be read, or a bad --set; and asks for a FILE', async () => {
    const bad = await run('explain', write('arch4.md', ARCH), 'c_gfs', '--json');
    expect(bad.code).toBe(2);
    expect(JSON.parse(bad.out).diagnostics[0]).toMatchObject({ ruleId: 'explain/unknown-name', message: expect.stringContaining('did you mean "c_gsf"') });
    expect((await run('explain', join(dir, 'missing.md'))).code).toBe(2);
    expect((await run('explain', write('arch5.md', ARCH), '--set', 'gsf=3'))).toMatchObject({ code: 2 });
    expect((await run('explain'))).toMatchObject({ code: 2, err: expect.stringContaining('explain needs a FILE') });
  });

  it('render --drivers adds the appendix to the sheet; render without it does not', async () => {
    const file = write('arch6.md', ARCH);
    expect((await run('render', file, '--drivers', '-o', join(dir, 'with.html'))).code).toBe(0);
    expect((await run('render', file, '-o', join(dir, 'without.html'))).code).toBe(0);
    const html = readFileSync(join(dir, 'with.html'), 'utf8');
    expect(html).toContain('What drives each check');
    expect(html).toMatch(/<code>t<\/code>/);
    expect(readFileSync(join(dir, 'without.html'), 'utf8')).not.toContain('What drives each check');
  });

  it('explainOnThreads on a worker thread and the main one gives exactly what one thread gives', async () => {
    const text = ARCH.replace('w_q = 5 kN/m  # read by nothing', 'w_q = 5 kN/m  # read by c_w').replace('c_gsf = gsf >= 2  # geometric factor of safety', 'c_gsf = gsf >= 2  # geometric factor of safety\nc_w = w_q * L <= 25 kN');
    const one = await explainDocument(text, { file: 'arch.md', targets: ['c_gsf', 'c_w', 'gsf'] });
    const two = await explainOnThreads(text, { file: 'arch.md', targets: ['c_gsf', 'c_w', 'gsf'] }, 2);
    expect(two.threads).toBe(2);
    expect(two.checks).toEqual(one.checks);
    expect(two.values).toEqual(one.values);
    expect(two.checks[0]!.inputs.length).toBe(4);
  });
});
