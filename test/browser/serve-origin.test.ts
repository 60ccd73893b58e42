/**
 * In a real browser: a page served from another localhost port cannot read the live sheet's
 * document or sources; the live sheet's own page can. Loopback only.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { startServer, type ServeHandle } from '../../bin/serve/server.js';
import { FIXTURES, tempCopy } from '../serve/helpers.js';
import { launchBrowser, type Browser } from './serve-helpers.js';

let browser: Browser;
let live: ServeHandle;
let other: Server;
let otherPort = 0;
let tmp: ReturnType<typeof tempCopy>;

beforeAll(async () => {
  tmp = tempCopy(join(FIXTURES, 'barrel.md'));
  live = await startServer({ file: tmp.file, port: 0, logLevel: 'silent' });
  // Another local page, on another port: it tries to read the live sheet's document and sources.
  other = createServer((_req, res) => {
    res.writeHead(200, { 'Content-Type': 'text/html' }).end('<!DOCTYPE html><title>another local page</title>');
  });
  await new Promise<void>((ok) => other.listen(0, '127.0.0.1', ok));
  otherPort = (other.address() as AddressInfo).port;
  browser = await launchBrowser();
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await live?.close();
  await new Promise((ok) => other?.close(ok));
  tmp?.cleanup();
});

/** What a fetch from `pageUrl` to `target` gets: the start of the body, or the error's name. */
async function readFrom(pageUrl: string, target: string): Promise<string> {
  const page = await browser.context.newPage();
  try {
    await page.goto(pageUrl);
    return await page.evaluate(async (url) => {
      try {
        const r = await fetch(url);
        return `read ${r.status}: ${(await r.text()).slice(0, 40)}`;
      } catch (e) {
        return `refused: ${(e as Error).name}`;
      }
    }, target);
  } finally {
    await page.close();
  }
}

describe('the live sheet in Chromium', () => {
  it('a page on another localhost port cannot read the document or the sources', { timeout: 120_000 }, async () => {
    const from = `http://127.0.0.1:${otherPort}/`;
    expect(await readFrom(from, `http://127.0.0.1:${live.port}/__doc`)).toBe('refused: TypeError');
    expect(await readFrom(from, `http://localhost:${live.port}/__doc`)).toBe('refused: TypeError');
    expect(await readFrom(from, `http://127.0.0.1:${live.port}/main.ts`)).toBe('refused: TypeError');
  });

  it('the live sheet\'s own page reads its document', { timeout: 120_000 }, async () => {
    expect(await readFrom(live.url, '/__doc')).toMatch(/^read 200: \{"text":"---\\ntitle: Cellar barrel/);
  });
});
