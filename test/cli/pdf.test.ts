/**
 * Printing to PDF fails in plain words: no terminal escape codes, no browser library's call log,
 * and a time limit that grows with the sheet.
 */
import { describe, it, expect } from 'vitest';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromiumPath, pdfTimeLimitMs, plainReason, printPdf, PdfError } from '../../bin/pdf.js';

describe('pdfTimeLimitMs', () => {
  it('pdfTimeLimitMs(bytes) is a minute plus 20 s per MB of sheet', () => {
    expect(pdfTimeLimitMs(0)).toBe(60_000);
    expect(pdfTimeLimitMs(1024 * 1024)).toBe(80_000);
    expect(pdfTimeLimitMs(40 * 1024 * 1024)).toBe(860_000);
  });
});

describe('plainReason', () => {
  it('plainReason(e) keeps the first sentence and drops colours, the call log and the API name', () => {
    const e = new Error('page.setContent: \u001b[31mTimeout 30000ms exceeded.\u001b[39m\nCall log:\n  - setting content\n  - waiting for load');
    expect(plainReason(e)).toBe('Timeout 30000ms exceeded.');
    expect(plainReason(new Error('browserContext.newPage: Target page, context or browser has been closed\n=========================== logs ===========================\n<launching> /usr/bin/chromium'))).toBe('Target page, context or browser has been closed');
  });
});

describe.skipIf(!existsSync(chromiumPath()))('printPdf with Chromium', () => {
  it('printPdf past its time limit throws a PdfError in one plain sentence and writes no file', { timeout: 120_000 }, async () => {
    const dir = mkdtempSync(join(tmpdir(), 'vaultbook-pdf-'));
    try {
      const out = join(dir, 'sheet.pdf');
      const html = `<!DOCTYPE html><html><body>${'<p>Fictional sheet line.</p>'.repeat(20_000)}</body></html>`;
      const error = await printPdf(html, out, undefined, 1).then(() => null, (e: unknown) => e);
      expect(error).toBeInstanceOf(PdfError);
      const message = (error as Error).message;
      expect(message).toMatch(/^printing took longer than 0\.0 s, the limit for a sheet of 0\.\d MB$/);
      expect(message).not.toMatch(/\u001b|Call log|\n/);
      expect(existsSync(out)).toBe(false);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
