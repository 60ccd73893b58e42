/**
 * Script injection: every payload of a corpus is written into the prose, the
 * front matter, input and check descriptions, a string value and a figure
 * line of a document; each rendered sheet is loaded in headless Chromium,
 * both standalone (with its Content-Security-Policy) and as the bare
 * <article> in a page without any policy, so the sanitising alone is tested
 * too. Listeners record dialogs, console messages, page errors and every
 * request other than data: and about: URLs; none may fire. Positive controls
 * show that each listener does catch what it is there for.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { CHROMIUM_PATH, launchPrinter, type Printer } from '../../bin/pdf.js';
import { renderDocument } from '../../bin/commands/render.js';
import { compile, startSession } from '../../engine/index.js';
import { renderSheet } from '../../engine/render/index.js';

const haveChromium = existsSync(CHROMIUM_PATH);
if (!haveChromium) console.warn(`sheet-injection tests skipped: no Chromium at ${CHROMIUM_PATH} (apt-get install chromium)`);

const BEACON = 'http://attacker.invalid/beacon';
/** A corpus of script-injection payloads: tags, handlers, URLs, encodings, SVG/MathML, CSS, markdown and TeX tricks. */
export const PAYLOADS: string[] = [
  '<script>alert(1)</script>',
  '<img src=x onerror=alert(2)>',
  '<svg onload=alert(3)>',
  '<svg><script>alert(4)</script></svg>',
  '<body onload=alert(5)>',
  '<iframe src="javascript:alert(6)"></iframe>',
  '<a href="javascript:alert(7)">click</a>',
  '[md link](javascript:alert(8))',
  '![md image](http://attacker.invalid/beacon.png)',
  `<img src="${BEACON}">`,
  '<input autofocus onfocus=alert(9)>',
  '<details open ontoggle=alert(10)>',
  '<video><source onerror=alert(11)></video>',
  '<math><mtext><table><mglyph><style><img src=x onerror=alert(12)>',
  '"><script>alert(13)</script>',
  "'><img src=x onerror=alert(14)>",
  '</style><script>alert(15)</script>',
  '</title><script>alert(16)</script>',
  '<style>@import "http://attacker.invalid/x.css";</style>',
  `<div style="background:url(${BEACON})">x</div>`,
  '<object data="javascript:alert(17)"></object>',
  '<embed src="javascript:alert(18)">',
  '<form action="javascript:alert(19)"><button>go</button></form>',
  '<meta http-equiv="refresh" content="0;url=javascript:alert(20)">',
  `<link rel="stylesheet" href="${BEACON}.css">`,
  '<base href="http://attacker.invalid/">',
  '<scr<script>ipt>alert(21)</scr</script>ipt>',
  '&lt;script&gt;alert(22)&lt;/script&gt;',
  '<IMG SRC=JaVaScRiPt:alert(23)>',
  '<a href="&#106;avascript:alert(24)">x</a>',
  '<svg><a xlink:href="javascript:alert(25)"><text y="20">x</text></a></svg>',
  '<svg><animate onbegin=alert(26) attributeName=x dur=1s>',
  '$\\href{javascript:alert(27)}{x}$',
  '$\\htmlClass{x}{y}\\url{javascript:alert(28)}$',
  '<template><script>alert(29)</script></template>',
  '<noscript><p title="</noscript><img src=x onerror=alert(30)>">',
  '<xmp><img src=x onerror=alert(31)></xmp>',
  '<select><style></select><img src=x onerror=alert(32)>',
  `<img srcset="${BEACON} 1x">`,
  '<svg><use href="data:image/svg+xml,<svg id=x xmlns=%22http://www.w3.org/2000/svg%22><image href=%221%22 onerror=%22alert(33)%22/></svg>#x"/></svg>',
];

/** A document with the payload everywhere a document can hold text. */
function documentWith(payload: string): string {
  const yaml = JSON.stringify(payload);
  const oneLine = payload.replace(/\n/g, ' ');
  const mathString = JSON.stringify(payload);
  return [
    '---', `title: ${yaml}`, `project: ${yaml}`, `calc_ref: ${yaml}`, `client: ${yaml}`, `basis: [${yaml}]`, '---', '',
    `Prose before: ${payload}`, '', payload, '',
    '```given', `L = 6.4 m   # ${oneLine} [3 m, 12 m]`, '```', '',
    '```calc', `s = ${mathString}   # ${oneLine}`, 'h = L / 2   # half span', '```', '',
    '```check', `h <= L   # ${oneLine}`, '```', '',
    '```figure', `${mathString}   # ${oneLine}`, '```', '',
  ].join('\n');
}

interface Caught { dialogs: string[]; console: string[]; errors: string[]; requests: string[] }

/** One page, reused for every load of a test, with listeners that record into the current load's record. */
async function loader(printer: Printer): Promise<{ load(html: string): Promise<Caught>; close(): Promise<void> }> {
  const page: Page = await printer.context.newPage();
  let caught: Caught = { dialogs: [], console: [], errors: [], requests: [] };
  page.on('dialog', (d) => { caught.dialogs.push(d.message()); void d.dismiss(); });
  page.on('console', (m) => caught.console.push(m.text()));
  page.on('pageerror', (e) => caught.errors.push(e.message));
  page.on('request', (r) => { if (!/^(data|about):/.test(r.url())) caught.requests.push(r.url()); });
  return {
    async load(html: string) {
      caught = { dialogs: [], console: [], errors: [], requests: [] };
      await page.setContent(html, { waitUntil: 'load' });
      // Give handlers that fire late (onerror of a failed load, autofocus, animations) a moment.
      await page.focus('body').catch(() => undefined);
      await page.waitForTimeout(100);
      // Leave the document so nothing of it runs into the next load.
      await page.setContent('<!DOCTYPE html><title>blank</title>');
      return caught;
    },
    close: () => page.close(),
  };
}

async function load(printer: Printer, html: string): Promise<Caught> {
  const l = await loader(printer);
  try { return await l.load(html); } finally { await l.close(); }
}

const nothing: Caught = { dialogs: [], console: [], errors: [], requests: [] };

describe.skipIf(!haveChromium)('script injection into a sheet', () => {
  let printer: Printer;
  beforeAll(async () => { printer = await launchPrinter(); }, 60_000);
  afterAll(async () => { await printer?.close(); });

  it('the corpus has at least 30 payloads', () => {
    expect(PAYLOADS.length).toBeGreaterThanOrEqual(30);
  });

  it('the listeners catch a real alert, console message, page error and request (positive controls)', async () => {
    expect((await load(printer, '<p>x</p><script>alert("control")</script>')).dialogs).toEqual(['control']);
    expect((await load(printer, '<script>console.log("control")</script>')).console).toEqual(['control']);
    expect((await load(printer, '<script>throw new Error("control")</script>')).errors).toEqual(['control']);
    expect((await load(printer, `<img src="${BEACON}">`)).requests).toEqual([BEACON]);
    expect((await load(printer, '<img src=x onerror="alert(\'handler\')">')).dialogs).toEqual(['handler']);
  }, 60_000);

  it('no payload runs or fetches anything from a standalone sheet', async () => {
    const l = await loader(printer);
    for (const payload of PAYLOADS) {
      const { html } = await renderDocument(documentWith(payload), 'payload.md', {}, { hash: '0'.repeat(64) });
      expect(await l.load(html), payload).toEqual(nothing);
    }
    await l.close();
  }, 300_000);

  it('no payload runs or fetches anything from the bare sheet article, without any content policy', async () => {
    const l = await loader(printer);
    for (const payload of PAYLOADS) {
      const doc = compile(documentWith(payload), { file: 'payload.md' });
      const session = startSession(doc);
      const states = await session.settle();
      const article = renderSheet({ doc, states, warnings: session.warnings, options: { standalone: false } });
      session.dispose();
      expect(article).not.toContain('Content-Security-Policy');
      expect(await l.load(`<!DOCTYPE html><html><head><meta charset="utf-8"></head><body>${article}</body></html>`), payload).toEqual(nothing);
    }
    await l.close();
  }, 300_000);
});
