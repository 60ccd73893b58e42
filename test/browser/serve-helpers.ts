/**
 * Shared by the live-sheet browser tests: Chromium with a fresh profile,
 * a server of our own per test (port 0, temp copy of a fixture), and waits
 * on the page's own events rather than on timers.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { startServer, type ServeHandle } from '../../bin/serve/server.js';
import { tempCopy } from '../serve/helpers.js';

export const CHROMIUM = '/usr/bin/chromium';
export const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];

export interface Browser {
  context: BrowserContext;
  close(): Promise<void>;
}

/** Headless Chromium with a throw-away user-data folder. */
export async function launchBrowser(): Promise<Browser> {
  const profile = mkdtempSync(join(tmpdir(), 'vaultbook-chromium-'));
  const context = await chromium.launchPersistentContext(profile, { executablePath: CHROMIUM, headless: true, args: CHROMIUM_ARGS, viewport: { width: 1400, height: 1000 } });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export interface Live {
  page: Page;
  server: ServeHandle;
  /** The temp copy being served. */
  file: string;
  dir: string;
  /** Page errors seen so far (a test asserts there are none). */
  errors: string[];
  close(): Promise<void>;
}

/**
 * Serves a temp copy of `fixture` and opens it.
 * @param prepare runs on the page before it loads (e.g. to route the websocket)
 * @param case the case the page opens on (`serve --case`)
 */
export async function openLive(browser: Browser, fixture: string, options: { transform?: (text: string) => string; prepare?: (page: Page) => Promise<void>; case?: string } = {}): Promise<Live> {
  const t = tempCopy(fixture);
  if (options.transform) {
    const { readFileSync, writeFileSync } = await import('node:fs');
    writeFileSync(t.file, options.transform(readFileSync(t.file, 'utf8')));
  }
  const server = await startServer({ file: t.file, port: 0, logLevel: (process.env.VB_LOG as 'info') ?? 'error', ...(options.case ? { case: options.case } : {}) });
  const page = await browser.context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('console', (m) => { if (m.type() === 'error') errors.push(m.text()); });
  await options.prepare?.(page);
  await page.goto(server.url);
  await page.evaluate(() => window.vaultbook.ready);
  return {
    page, server, file: t.file, dir: t.dir, errors,
    close: async () => {
      await page.close();
      await server.close();
      t.cleanup();
    },
  };
}

/** Runs `action` and resolves with the next `vaultbook:<event>` detail the page fires. */
export async function nextEvent<T = unknown>(page: Page, event: 'patched' | 'settled' | 'loaded' | 'written', action: () => Promise<unknown>, timeout = 20_000): Promise<T> {
  await page.evaluate((name) => {
    const w = window as unknown as { __next?: Record<string, Promise<unknown>> };
    w.__next ??= {};
    w.__next[name] = new Promise((ok) => document.addEventListener(`vaultbook:${name}`, (e) => ok((e as CustomEvent).detail), { once: true }));
  }, event);
  await action();
  return page.evaluate(({ name, timeout: ms }) => {
    const w = window as unknown as { __next: Record<string, Promise<unknown>> };
    return Promise.race([w.__next[name], new Promise((_, no) => setTimeout(() => no(new Error(`no vaultbook:${name} within ${ms} ms`)), ms))]);
  }, { name: event, timeout }) as Promise<T>;
}

/** Opens an input's field, types a value and presses Enter; resolves once every changed element is patched. */
export async function editInput(page: Page, name: string, text: string): Promise<{ changed: string[]; patched: string[] }> {
  return nextEvent(page, 'settled', async () => {
    await page.click(`[data-input="${name}"]`);
    await page.fill(`input.lv-edit[data-edit="${name}"]`, text);
    await page.keyboard.press('Enter');
  });
}

/** The text of a cell's output region (textContent: off-screen parts of the sheet are not laid out). */
export async function cellText(page: Page, id: string): Promise<string> {
  return (await page.locator(`[data-cell="${id}"]`).textContent()) ?? '';
}
