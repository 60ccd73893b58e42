import { describe, it, expect, afterEach } from 'vitest';
import { writeFileSync, renameSync, readdirSync, statSync, chmodSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { spawnSync } from 'node:child_process';
import { watchDocument, type DocumentWatch } from '../../bin/serve/watch.js';
import { versionOf } from '../../bin/serve/version.js';
import { writeFileAtomic, removeStaleTemps } from '../../bin/serve/atomic.js';
import { FIXTURES, tempCopy } from './helpers.js';

const cleanups: Array<() => void> = [];
afterEach(() => { while (cleanups.length) cleanups.pop()!(); });

function setup() {
  const t = tempCopy(join(FIXTURES, 'barrel.md'));
  cleanups.push(t.cleanup);
  return t;
}

/** Waits for the next reported change (or fails after `ms`). */
function nextChange(events: string[], count: number, ms = 5000): Promise<void> {
  return new Promise((ok, fail) => {
    const start = Date.now();
    const tick = () => (events.length >= count ? ok() : Date.now() - start > ms ? fail(new Error(`no change within ${ms} ms`)) : setTimeout(tick, 10));
    tick();
  });
}

describe('watchDocument', () => {
  it('watchDocument reports an in-place save and a save by rename, each once, within a second', async () => {
    const { file, dir } = setup();
    const events: string[] = [];
    const w: DocumentWatch = watchDocument(file, versionOf(readFileSync(file)), (_b, v) => events.push(v));
    cleanups.push(() => w.close());
    let t0 = Date.now();
    writeFileSync(file, 'first save\n');
    await nextChange(events, 1);
    expect(Date.now() - t0).toBeLessThan(1000);
    expect(events).toEqual([versionOf('first save\n')]);
    t0 = Date.now();
    writeFileSync(join(dir, 'calc.md.swp'), 'second save\n');
    renameSync(join(dir, 'calc.md.swp'), file);
    await nextChange(events, 2);
    expect(Date.now() - t0).toBeLessThan(1000);
    expect(events[1]).toBe(versionOf('second save\n'));
    // Touching a neighbour or rewriting the same bytes reports nothing.
    writeFileSync(join(dir, 'other.md'), 'x');
    writeFileSync(file, 'second save\n');
    await new Promise((r) => setTimeout(r, 500));
    expect(events).toHaveLength(2);
  });

  it('watchDocument still reports a change by polling when fs.watch is silent', async () => {
    const { file } = setup();
    const events: string[] = [];
    const w = watchDocument(file, versionOf(readFileSync(file)), (_b, v) => events.push(v), { fsWatch: false });
    cleanups.push(() => w.close());
    const t0 = Date.now();
    writeFileSync(file, 'saved on a quiet file system\n');
    await nextChange(events, 1);
    expect(Date.now() - t0).toBeLessThan(1000);
    expect(events).toEqual([versionOf('saved on a quiet file system\n')]);
  });

  it('watchDocument does not report a version the server wrote itself', async () => {
    const { file } = setup();
    const events: string[] = [];
    const w = watchDocument(file, versionOf(readFileSync(file)), (_b, v) => events.push(v));
    cleanups.push(() => w.close());
    writeFileAtomic(file, 'written by the server\n');
    w.known(versionOf('written by the server\n'));
    await new Promise((r) => setTimeout(r, 600));
    expect(events).toEqual([]);
  });
});

describe('writeFileAtomic', () => {
  it('writeFileAtomic replaces the bytes, keeps the permission bits and leaves no temp file', () => {
    const { file, dir } = setup();
    chmodSync(file, 0o640);
    writeFileAtomic(file, Buffer.from('new ✓ text\r\n', 'utf8'));
    expect(readFileSync(file, 'utf8')).toBe('new ✓ text\r\n');
    expect(statSync(file).mode & 0o777).toBe(0o640);
    expect(readdirSync(dir)).toEqual(['calc.md']);
  });

  it('removeStaleTemps removes temp files of writers that no longer run, and only those', () => {
    const { file, dir } = setup();
    // A pid that surely has exited: a finished child's.
    const dead = spawnSync(process.execPath, ['-e', '0']).pid;
    const stale = `.calc.md.vaultbook-${dead}-deadbeef.tmp`;
    const live = `.calc.md.vaultbook-${process.pid}-cafebabe.tmp`;
    const foreign = `.other.md.vaultbook-${dead}-00000000.tmp`;
    for (const n of [stale, live, foreign]) writeFileSync(join(dir, n), 'partial');
    expect(removeStaleTemps(file)).toEqual([stale]);
    expect(readdirSync(dir).sort()).toEqual([foreign, live, 'calc.md'].sort());
  });
});
