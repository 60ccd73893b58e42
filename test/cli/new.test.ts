import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdtemp, writeFile, readFile, rm, mkdir } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { makeNewCommand, listTemplates } from '../../bin/commands/new.js';

// Two fictional starter templates in a temporary templates folder.
const STARTER = `---
title: Lintel over a garden door (fictional starter)
project: Example
---
# Lintel

\`\`\`given
L = 1.2 m   # clear opening
\`\`\`
`;
const NO_FRONT_MATTER = '# Pier starter\n\nA pier.\n';

let dir: string;
let templates: string;
const run = async (...args: string[]) => {
  const out: string[] = [], err: string[] = [];
  const code = await makeNewCommand(templates)(args, (s) => out.push(s), (s) => err.push(s));
  return { code, out: out.join('\n'), err: err.join('\n') };
};

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'vaultbook-new-'));
  templates = join(dir, 'templates');
  await mkdir(templates);
  await writeFile(join(templates, 'lintel.md'), STARTER);
  await writeFile(join(templates, 'pier.md'), NO_FRONT_MATTER);
  await writeFile(join(templates, 'notes.txt'), 'not a template');
});
afterAll(() => rm(dir, { recursive: true, force: true }));

describe('vaultbook new', () => {
  it('listTemplates(dir) reads each title from front matter, else the first heading', async () => {
    expect((await listTemplates(templates)).map((t) => [t.name, t.title])).toEqual([
      ['lintel', 'Lintel over a garden door (fictional starter)'],
      ['pier', 'Pier starter'],
    ]);
  });

  it('new (no TEMPLATE) lists the templates with their titles and exits 0', async () => {
    const r = await run();
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^lintel\s+Lintel over a garden door \(fictional starter\)$/m);
    expect(r.out).toMatch(/^pier\s+Pier starter$/m);
    expect(r.out).not.toContain('notes');
  });

  it('new UNKNOWN FILE lists the templates, says which was not found, exits 2 and creates nothing', async () => {
    const target = join(dir, 'x.md');
    const r = await run('vault', target);
    expect(r.code).toBe(2);
    expect(r.err).toContain('no template "vault"');
    expect(r.out).toContain('lintel');
    await expect(readFile(target, 'utf8')).rejects.toThrow(/ENOENT/);
  });

  it('new TEMPLATE FILE copies the template (with or without .md)', async () => {
    const target = join(dir, 'door.md');
    const r = await run('lintel.md', target);
    expect(r.code).toBe(0);
    expect(r.out).toContain(`Created ${target} from template lintel`);
    expect(await readFile(target, 'utf8')).toBe(STARTER);
  });

  it('new TEMPLATE FILE refuses to overwrite an existing FILE (exit 2, file untouched)', async () => {
    const target = join(dir, 'mine.md');
    await writeFile(target, 'my own work');
    const r = await run('pier', target);
    expect(r.code).toBe(2);
    expect(r.err).toContain('already exists; not overwritten');
    expect(await readFile(target, 'utf8')).toBe('my own work');
  });

  it('new TEMPLATE without FILE is a usage error', async () => {
    await expect(run('lintel')).rejects.toThrow(/TEMPLATE and the FILE/);
  });
});
