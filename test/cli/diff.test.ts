import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdtemp, writeFile, rm, mkdir } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { execFileSync } from 'node:child_process';
import { diffCommand } from '../../bin/commands/diff.js';
import { diffProse, editScript } from '../../bin/diff/prose.js';
import type { DocumentDiff } from '../../bin/diff/document.js';
import type { Block } from '../../engine/index.js';
import { expectClose } from '../helpers/close.js';

// Fictional two-revision calc: a floor beam over the (invented) Larkhollow gatehouse.
// Hand values: M = q L² / 8 (simply supported beam, common practice).
const OLD = `---
title: Gatehouse beam (fictional)
revision: A
---
# Gatehouse beam

The beam spans between the two gate piers.

It carries the floor of the warden's room.

Loads are taken from the client's brief.

The moment is checked against an agreed limit.

\`\`\`given
L = 6 m        # span [3 m, 12 m]
q = 10 kN/m    # design load
W = 45 kN m    # same value, written differently in the new version
\`\`\`

\`\`\`calc
M = q * L^2 / 8 to kN m   # midspan moment
r = {a: 2000 mm, b: 3}
gone = 1 m
\`\`\`

\`\`\`check
c_moment = M <= 50 kN m   # moment limit
c_span = L <= 5 m         # span limit (fails in A)
q <= 20 kN/m
\`\`\`
`;

const NEW = `---
title: Gatehouse beam (fictional)
revision: B
---
# Gatehouse beam

The beam spans between the two rebuilt gate piers.

It carries the floor of the warden's room and a water tank.

Loads are taken from the client's revised brief.

The moment is checked against an
agreed limit.

A note on the tank was added in revision B.

\`\`\`given
L = 7 m        # span [3 m, 12 m]
q = 10 kN/m    # design load
W = 45000 N m  # same value, written differently
\`\`\`

\`\`\`calc
M = q * L^2 / 8 to kN m   # midspan moment
r = {a: 2.5 m, b: 3}
extra = 2 m
\`\`\`

\`\`\`check
c_moment = M <= 50 kN m   # moment limit
c_span = L <= 8 m         # span limit (holds in B)
q <= 20 kN/m
\`\`\`
`;

let dir: string;
const run = async (...args: string[]) => {
  const out: string[] = [], err: string[] = [];
  const code = await diffCommand(args, (s) => out.push(s), (s) => err.push(s));
  return { code, out: out.join('\n'), err: err.join('\n') };
};
const json = async (...args: string[]) => {
  const r = await run(...args, '--json');
  return { code: r.code, d: JSON.parse(r.out) as DocumentDiff };
};

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'vaultbook-diff-'));
  await writeFile(join(dir, 'old.md'), OLD);
  await writeFile(join(dir, 'new.md'), NEW);
  await writeFile(join(dir, 'broken.md'), NEW.replace('M = q * L^2 / 8', 'M = q * Lx^2 / 8'));
});
afterAll(() => rm(dir, { recursive: true, force: true }));

describe('vaultbook diff OLD NEW', () => {
  it('diff OLD NEW lists the changed input with its percentage', async () => {
    const { d } = await json(join(dir, 'old.md'), join(dir, 'new.md'));
    expect(d.inputs.map((v) => v.name)).toEqual(['L']);
    const f = d.inputs[0]!.fields[0]!;
    expect(f.change).toBe('moved');
    expect([f.old!.value, f.new!.value, f.unit]).toEqual([6, 7, 'm']);
    expectClose(f.percent!, (100 * (7 - 6)) / 6, 1e-12);
  });

  it('diff OLD NEW moves M by the hand-calculated amount (M = qL²/8: 45 → 61.25 kN m)', async () => {
    const { d } = await json(join(dir, 'old.md'), join(dir, 'new.md'));
    const m = d.results.find((v) => v.name === 'M')!.fields[0]!;
    expectClose(m.old!.value as number, (10 * 6 ** 2) / 8, 1e-12);
    expectClose(m.new!.value as number, (10 * 7 ** 2) / 8, 1e-12);
    expectClose(m.percent!, 100 * (61.25 - 45) / 45, 1e-12);
  });

  it('diff OLD NEW compares in one unit: 45 kN m against 45000 N m is no change, 2000 mm → 2.5 m is +25 %', async () => {
    const { d } = await json(join(dir, 'old.md'), join(dir, 'new.md'));
    expect(d.inputs.find((v) => v.name === 'W')).toBeUndefined();
    const ra = d.results.find((v) => v.name === 'r')!.fields;
    expect(ra.map((f) => f.path)).toEqual(['.a']);
    expect(ra[0]!.unit).toBe('m');
    expectClose(ra[0]!.old!.value as number, 2, 1e-12);
    expectClose(ra[0]!.percent!, 25, 1e-12);
  });

  it('diff OLD NEW reports a check flipped to fail and exits 1', async () => {
    const { code, d } = await json(join(dir, 'old.md'), join(dir, 'new.md'));
    const byKey = Object.fromEntries(d.checks.map((c) => [c.key, c]));
    expect(byKey.c_moment!.change).toBe('to-fail');
    expectClose(byKey.c_moment!.old!.utilization!, 45 / 50, 1e-12);
    expectClose(byKey.c_moment!.new!.utilization!, 61.25 / 50, 1e-12);
    expect(byKey.c_span!.change).toBe('to-pass');
    expect(byKey['q <= 20 kN/m']).toBeUndefined(); // unnamed and unchanged: matched by its expression
    expect(d.new_failures).toBe(1);
    expect(code).toBe(1);
  });

  it('diff NEW OLD (the other way) only flips to pass for c_moment and fails c_span: exit 1', async () => {
    const { code, d } = await json(join(dir, 'new.md'), join(dir, 'old.md'));
    expect(d.checks.find((c) => c.key === 'c_moment')!.change).toBe('to-pass');
    expect(d.checks.find((c) => c.key === 'c_span')!.change).toBe('to-fail');
    expect(code).toBe(1);
  });

  it('diff FILE FILE finds nothing and exits 0', async () => {
    const r = await run(join(dir, 'new.md'), join(dir, 'new.md'));
    expect(r.code).toBe(0);
    expect(r.out).toContain('No differences');
  });

  it('diff OLD NEW lists added and removed cells', async () => {
    const { d } = await json(join(dir, 'old.md'), join(dir, 'new.md'));
    expect(d.added.map((c) => c.name)).toEqual(['extra']);
    expect(d.removed.map((c) => c.name)).toEqual(['gone']);
  });

  it('diff OLD NEW sums up prose: 3 paragraphs changed, 1 added; re-wrapping is not a change', async () => {
    const { d } = await json(join(dir, 'old.md'), join(dir, 'new.md'));
    expect([d.prose.changed, d.prose.added, d.prose.removed]).toEqual([3, 1, 0]);
    expect(d.prose.paragraphs.find((p) => p.change === 'added')!.new!.text).toContain('A note on the tank');
    expect(d.meta).toEqual([{ key: 'revision', old: 'A', new: 'B' }]);
  });

  it('diff OLD NEW prints a human report with the flip first', async () => {
    const r = await run(join(dir, 'old.md'), join(dir, 'new.md'));
    const lines = r.out.split('\n');
    expect(lines[0]).toBe(`${join(dir, 'old.md')} → ${join(dir, 'new.md')}`);
    const flip = lines.findIndex((l) => /^\s*!!\s+c_moment\s+holds → FAILS\s+utilization 0\.90 → 1\.23/.test(l));
    expect(flip).toBeGreaterThan(0);
    expect(r.out).toMatch(/^\s*L\s+6 m → 7 m\s+\+16\.7 %/m);
    expect(r.out).toMatch(/^\s*M\s+45 kN m → 61\.25 kN m\s+\+36\.1 %/m);
    expect(r.out).toContain('Prose: 3 paragraphs changed, 1 added');
    expect(r.out).toContain('Verdict: 1 check now fails that did not before.');
  });

  it('diff exits 2 when a file cannot be read or the new version has errors', async () => {
    const missing = await run(join(dir, 'old.md'), join(dir, 'nope.md'));
    expect(missing.code).toBe(2);
    expect(missing.err).toContain('no such file');
    const broken = await json(join(dir, 'old.md'), join(dir, 'broken.md'));
    expect(broken.code).toBe(2);
    expect(broken.d.errors_introduced.map((e) => e.ruleId)).toContain('graph/unknown-name');
  });

  it('diff refuses a wrong number of files (usage error)', async () => {
    await expect(run(join(dir, 'old.md'))).rejects.toThrow(/OLD and NEW/);
  });
});

describe('vaultbook diff FILE --rev REV', () => {
  let repo: string;
  beforeAll(async () => {
    repo = await mkdtemp(join(tmpdir(), 'vaultbook-git-'));
    const g = (...args: string[]) => execFileSync('git', args, { cwd: repo, stdio: 'pipe' });
    g('init', '-q');
    g('config', 'user.name', 'Test Engineer');
    g('config', 'user.email', 'test@example.invalid');
    g('config', 'commit.gpgsign', 'false');
    await mkdir(join(repo, 'calcs', 'gatehouse'), { recursive: true });
    await writeFile(join(repo, 'calcs', 'gatehouse', 'beam.md'), OLD);
    g('add', '.');
    g('commit', '-q', '-m', 'revision A');
    await writeFile(join(repo, 'calcs', 'gatehouse', 'beam.md'), NEW);
    g('commit', '-q', '-a', '-m', 'revision B');
  });
  afterAll(() => rm(repo, { recursive: true, force: true }));

  it('diff FILE --rev HEAD~1 reads the old version from git, from any working folder', async () => {
    const file = join(repo, 'calcs', 'gatehouse', 'beam.md');
    const { code, d } = await json(file, '--rev', 'HEAD~1');
    expect(d.old.label).toBe(`${file}@HEAD~1`);
    expect(d.inputs.map((v) => v.name)).toEqual(['L']);
    expect(d.checks.find((c) => c.key === 'c_moment')!.change).toBe('to-fail');
    expect(code).toBe(1);
  });

  it('diff FILE --rev HEAD finds nothing when the file is committed', async () => {
    const r = await run(join(repo, 'calcs', 'gatehouse', 'beam.md'), '--rev', 'HEAD');
    expect(r.code).toBe(0);
    expect(r.out).toContain('No differences');
  });

  it('diff FILE --rev with an unknown revision exits 2 with git\'s reason', async () => {
    const r = await run(join(repo, 'calcs', 'gatehouse', 'beam.md'), '--rev', 'no-such-rev');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--rev no-such-rev: no such commit in this repository/);
  });
});

describe('diffProse', () => {
  const prose = (raw: string): Block[] => [{ kind: 'prose', raw, span: { start: { line: 1, column: 1, offset: 0 }, end: { line: 1, column: 1, offset: 0 } } }];

  it('editScript(a, b) keeps the longest common subsequence', () => {
    const ops = editScript(['a', 'b', 'c', 'd'], ['a', 'c', 'x', 'd']);
    expect(ops.filter((o) => o.op === 'same').length).toBe(3);
    expect(ops.filter((o) => o.op !== 'same').map((o) => o.op).sort()).toEqual(['del', 'ins']);
  });

  it('diffProse pairs a removed and an added paragraph as one change, and counts removals', () => {
    const d = diffProse(prose('one\n\ntwo\n\nthree\n\nfour'), prose('one\n\ntwo, edited\n\nfour'));
    expect([d.changed, d.added, d.removed]).toEqual([1, 0, 1]);
    expect(d.paragraphs[0]!.old!.line).toBe(3);
    expect([d.lines_added, d.lines_removed]).toEqual([1, 2]);
  });
});
