/**
 * A server killed (SIGKILL) while writing inputs back leaves the document
 * whole: either the old bytes or the new bytes, never a mix. The server runs
 * as a child process (`vaultbook serve`); the page asks for the write and the
 * kill lands at a random moment after the click, or while the temp file is
 * being written. The document is padded with ~1 MB of notes so the write
 * takes long enough to be interrupted.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync, readdirSync, watch, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { rewriteGivenValues } from '../../bin/serve/rewrite.js';
import { FIXTURES, REPO, tempCopy } from '../serve/helpers.js';
import { launchBrowser, editInput, nextEvent, type Browser } from './serve-helpers.js';

let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); }, 60_000);
afterAll(async () => { await browser?.close(); });

/** Starts `vaultbook serve FILE --port 0` and resolves with the child and the URL it prints. */
function serve(file: string): Promise<{ child: ChildProcess; url: string }> {
  return new Promise((ok, fail) => {
    const child = spawn(process.execPath, [join(REPO, 'bin', 'vaultbook.js'), 'serve', file, '--port', '0'], { stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    const timer = setTimeout(() => { child.kill('SIGKILL'); fail(new Error(`no URL within 60 s: ${out}`)); }, 60_000);
    child.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      const m = /at (http:\/\/127\.0\.0\.1:\d+\/)/.exec(out);
      if (m) { clearTimeout(timer); ok({ child, url: m[1]! }); }
    });
    child.stderr!.on('data', (d: Buffer) => { out += d.toString(); });
    child.on('exit', (code) => { clearTimeout(timer); fail(new Error(`server exited (${code}) before printing its URL: ${out}`)); });
  });
}

function exited(child: ChildProcess): Promise<void> {
  return new Promise((ok) => (child.exitCode !== null || child.signalCode !== null ? ok() : child.once('exit', () => ok())));
}

/** Resolves when a temp file appears beside `file` (the server has started writing). */
function tempAppears(dir: string): { promise: Promise<void>; stop: () => void } {
  let stop = () => {};
  const promise = new Promise<void>((ok) => {
    const w = watch(dir, (_e, name) => { if (name?.endsWith('.tmp')) { w.close(); ok(); } });
    stop = () => w.close();
  });
  return { promise, stop };
}

describe('write-back under SIGKILL', { timeout: 600_000 }, () => {
  it('a server killed at a random moment of a write leaves either the old or the new file', async () => {
    const t = tempCopy(join(FIXTURES, 'barrel.md'));
    const notes = Array.from({ length: 15_000 }, (_, i) => `site note ${i}: joint ${i % 97} repointed, see photo ${i} (fictional)`).join('\n');
    writeFileSync(t.file, `${readFileSync(t.file, 'utf8')}\n## Site notes (fictional)\n\n\`\`\`text\n${notes}\n\`\`\`\n`);
    const outcomes: string[] = [];
    let writeMs = 0;
    try {
      // Round 0 measures an undisturbed write; then the kill lands either at a random moment
      // within that time after the click (odd rounds) or just after the temp file appears,
      // i.e. during the write itself (even rounds).
      for (let round = 0; round < 5; round++) {
        const before = readFileSync(t.file);
        const value = `${(5 + round / 10).toFixed(1)} m`;
        const after = Buffer.from(rewriteGivenValues(before.toString('utf8'), { L: value }).text, 'utf8');
        expect(after.equals(before)).toBe(false);
        const { child, url } = await serve(t.file);
        const page = await browser.context.newPage();
        let how = 'no kill';
        try {
          const response = await page.goto(url);
          if (!response?.ok()) throw new Error(`GET ${url}: ${response?.status()} ${await response?.text()}`);
          await page.evaluate(() => window.vaultbook.ready);
          await editInput(page, 'L', value);
          if (round === 0) {
            const t0 = Date.now();
            await nextEvent(page, 'written', () => page.click('#lv-review [data-action="write"]'));
            writeMs = Date.now() - t0;
          } else {
            const temp = tempAppears(t.dir);
            const delay = round % 2 === 1 ? Math.random() * writeMs * 1.2 : Math.random();
            await page.click('#lv-review [data-action="write"]');
            if (round % 2 === 0) await Promise.race([temp.promise, new Promise((r) => setTimeout(r, 10_000))]);
            await new Promise((r) => setTimeout(r, delay));
            child.kill('SIGKILL');
            temp.stop();
            how = round % 2 === 1 ? `killed ${delay.toFixed(0)} ms after the click` : `killed ${delay.toFixed(1)} ms after the temp file appeared`;
          }
        } finally {
          child.kill('SIGKILL');
          await exited(child);
          await page.close();
        }
        const now = readFileSync(t.file);
        const state = now.equals(before) ? 'old' : now.equals(after) ? 'new' : 'PARTIAL';
        const temps = readdirSync(t.dir).filter((n) => n.endsWith('.tmp')).length;
        outcomes.push(`${how}: ${state}${temps ? ' + temp file left' : ''}`);
        expect(state, how).not.toBe('PARTIAL');
        if (round === 0) expect(state).toBe('new');
      }
      console.log(`SIGKILL during write-back (${(readFileSync(t.file).length / 1e6).toFixed(1)} MB document, undisturbed write ${writeMs} ms):\n  ${outcomes.join('\n  ')}`);
      // The next server clears what killed writers left behind.
      const { child } = await serve(t.file);
      child.kill('SIGKILL');
      await exited(child);
      expect(readdirSync(t.dir).filter((n) => n.endsWith('.tmp'))).toEqual([]);
    } finally {
      t.cleanup();
    }
  });
});
