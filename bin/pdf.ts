/**
 * Printing a sheet to PDF with the system's Chromium (Debian's package),
 * driven by playwright-core. No browser is ever downloaded: when
 * /usr/bin/chromium is missing the caller gets ChromiumMissingError and
 * tells the user how to install it.
 */
import { existsSync } from 'node:fs';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';

/** Where Debian installs Chromium. */
export const CHROMIUM_PATH = '/usr/bin/chromium';

/** The Chromium to use: VAULTBOOK_CHROMIUM when set, else Debian's. */
export function chromiumPath(): string {
  return process.env.VAULTBOOK_CHROMIUM || CHROMIUM_PATH;
}

export const CHROMIUM_ARGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update',
  '--disable-sync', '--no-first-run',
];

export class ChromiumMissingError extends Error {
  override name = 'ChromiumMissingError';
  constructor(path: string) {
    super(`Chromium is needed to print PDF and was not found at ${path}.\n`
      + '  Install it with:  apt-get install -y chromium\n'
      + '  (or point VAULTBOOK_CHROMIUM at another Chromium executable)');
  }
}

/** A PDF that could not be printed, with the reason in the user's words (no escape codes, no call log). */
export class PdfError extends Error {
  override name = 'PdfError';
}

/**
 * How long printing a sheet may take: a minute, and 20 s more for every MB of HTML (a 5 MB calc
 * makes a sheet of tens of MB and hundreds of pages).
 * @param htmlBytes size of the standalone sheet
 */
export function pdfTimeLimitMs(htmlBytes: number): number {
  return Math.round(60_000 + 20_000 * (htmlBytes / (1024 * 1024)));
}

/** A browser library's error as one plain sentence: no terminal colours, no call log, no API names. */
export function plainReason(e: unknown): string {
  const text = (e instanceof Error ? e.message : String(e)).replace(/\x1b\[[0-9;]*[A-Za-z]/g, '');
  const first = text.split(/\n\s*(?:Call log:|=+ )/)[0]!.split('\n')[0]!.trim();
  return first.replace(/^(?:[a-zA-Z]+\.)+[a-zA-Z]+: /, '').replace(/^Error: /, '') || 'the browser stopped';
}

export interface Printer {
  context: BrowserContext;
  /** Opens the HTML in a fresh page; every request other than data: and about: is refused. */
  open(html: string, timeoutMs?: number): Promise<Page>;
  close(): Promise<void>;
}

/**
 * Starts headless Chromium with a fresh, throw-away profile.
 * @throws ChromiumMissingError when the executable is absent
 */
export async function launchPrinter(executablePath = chromiumPath()): Promise<Printer> {
  if (!existsSync(executablePath)) throw new ChromiumMissingError(executablePath);
  const { chromium } = await import('playwright-core');
  const profile = await mkdtemp(join(tmpdir(), 'vaultbook-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath, headless: true, args: CHROMIUM_ARGS, offline: true, javaScriptEnabled: true,
  });
  await context.route('**/*', (route) => {
    const url = route.request().url();
    return url.startsWith('data:') || url.startsWith('about:') ? route.continue() : route.abort();
  });
  return {
    context,
    async open(html: string, timeoutMs = pdfTimeLimitMs(Buffer.byteLength(html))) {
      const page = await context.newPage();
      page.setDefaultTimeout(timeoutMs);
      await page.setContent(html, { waitUntil: 'load', timeout: timeoutMs });
      await page.evaluate(() => document.fonts.ready.then(() => undefined));
      return page;
    },
    async close() {
      await context.close();
      await rm(profile, { recursive: true, force: true });
    },
  };
}

/**
 * Prints a standalone sheet to a PDF file (A4 and margins from the sheet's @page rules).
 * @param html the standalone sheet
 * @param outFile where to write the PDF
 * @param timeLimitMs how long it may take (default pdfTimeLimitMs of the sheet's size)
 * @returns the PDF's bytes; throws PdfError in plain words when it cannot be printed in time
 * @example await printPdf(html, 'calc.pdf')
 */
export async function printPdf(html: string, outFile: string | null, printer?: Printer, timeLimitMs?: number): Promise<Buffer> {
  const own = printer ?? await launchPrinter();
  const bytes = Buffer.byteLength(html);
  const limit = timeLimitMs ?? pdfTimeLimitMs(bytes);
  const tooLong = () => `printing took longer than ${limit < 10_000 ? (limit / 1000).toFixed(1) : Math.round(limit / 1000)} s, the limit for a sheet of ${(bytes / (1024 * 1024)).toFixed(1)} MB`;
  let timer: NodeJS.Timeout | undefined;
  const overtime = new Promise<never>((_, fail) => {
    timer = setTimeout(() => fail(new PdfError(tooLong())), limit);
  });
  const print = async () => {
    const page = await own.open(html, limit);
    await page.emulateMedia({ media: 'print' });
    const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true, displayHeaderFooter: false, tagged: true });
    await page.close();
    return pdf;
  };
  try {
    const printing = print();
    // Past the time limit the print is abandoned (the browser closes below); its end is not news.
    printing.catch(() => undefined);
    const pdf = await Promise.race([printing, overtime]);
    if (outFile) await writeFile(outFile, pdf);
    return pdf;
  } catch (e) {
    if (e instanceof PdfError) throw e;
    throw new PdfError(/timeout/i.test(String((e as Error).message)) ? tooLong() : plainReason(e));
  } finally {
    clearTimeout(timer);
    // Closing the browser also ends a print still running after the time limit.
    if (!printer) await own.close().catch(() => undefined);
  }
}
