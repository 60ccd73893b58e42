import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdirSync, mkdtempSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { request } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { buildSite, inlinable, sourceKey, splitPage } from '../../bin/serve/built-site.js';
import { pointAssets } from '../../bin/serve/first-paint.js';
import { startServer, type ServeHandle } from '../../bin/serve/server.js';
import { FIXTURES, rawRequest, tempCopy } from './helpers.js';

describe('sourceKey', () => {
  it('sourceKey changes when a source file is added or changed, and only then', () => {
    const root = mkdtempSync(join(tmpdir(), 'vaultbook-key-'));
    try {
      for (const d of ['site', 'engine', 'cells']) mkdirSync(join(root, d));
      writeFileSync(join(root, 'site', 'main.ts'), 'a');
      const k1 = sourceKey(root);
      expect(sourceKey(root)).toBe(k1);
      writeFileSync(join(root, 'engine', 'x.ts'), 'b');
      const k2 = sourceKey(root);
      expect(k2).not.toBe(k1);
      utimesSync(join(root, 'engine', 'x.ts'), new Date(0), new Date(1000));
      expect(sourceKey(root)).not.toBe(k2);
    } finally { rmSync(root, { recursive: true, force: true }); }
  });
});

describe('serve from the built page', () => {
  let server: ServeHandle;
  let tmp: ReturnType<typeof tempCopy>;
  beforeAll(async () => {
    tmp = tempCopy(join(FIXTURES, 'barrel.md'));
    server = await startServer({ file: tmp.file, port: 0, logLevel: 'silent' });
  }, 120_000);
  afterAll(async () => { await server?.close(); tmp?.cleanup(); });

  it('buildSite reuses the build while the sources are unchanged', async () => {
    const again = await buildSite();
    expect(again.built).toBe(false);
  });

  it('GET / is the built page: one script from /assets/, no development client', async () => {
    const page = await rawRequest(server.port, '/');
    expect(page.status).toBe(200);
    expect(page.body).not.toContain('/@vite/client');
    const scripts = [...page.body.matchAll(/<script[^>]*src="([^"]+)"/g)].map((m) => m[1]!);
    expect(scripts.length).toBe(1);
    expect(scripts[0]).toMatch(/^\/assets\/[\w-]+\.js$/);
    const js = await rawRequest(server.port, scripts[0]!);
    expect([js.status, js.headers['content-type']]).toEqual([200, 'text/javascript; charset=utf-8']);
  });

  it('GET / carries the sheet rendered by the server inside #lv-sheet, with its style sheet, before the page\'s script runs', async () => {
    const page = (await rawRequest(server.port, '/')).body;
    const sheet = JSON.parse((await rawRequest(server.port, '/__sheet')).body) as { html: string };
    expect(page).toContain(`<main id="lv-sheet" class="lv-page" aria-label="calc sheet">${sheet.html}</main>`);
    expect(page).toContain('<body class="lv-waiting">');
    expect(page.match(/<style id="lv-sheet-css">/g)?.length).toBe(1);
    expect(page.indexOf('<style id="lv-sheet-css">')).toBeLessThan(page.indexOf('</head>'));
  });

  it('GET /__sheet is the sheet rendered by the server, for the page to paint at once', async () => {
    const r = await rawRequest(server.port, '/__sheet');
    expect(r.status).toBe(200);
    const body = JSON.parse(r.body) as { version: string; html: string };
    const doc = JSON.parse((await rawRequest(server.port, '/__doc')).body) as { version: string };
    expect(body.version).toBe(doc.version);
    expect(body.html).toMatch(/^<article class="vb-sheet"/);
    expect(body.html).toContain('data-input="L"');
  });

  it('/__events streams a "doc" event when the file changes on disk', async () => {
    const got = await new Promise<string>((ok, fail) => {
      const req = request({ host: '127.0.0.1', port: server.port, path: '/__events', headers: { Host: `127.0.0.1:${server.port}` } }, (res) => {
        let data = '';
        res.on('data', (c: Buffer) => {
          data += c.toString();
          if (data.includes('event: doc')) { req.destroy(); ok(data); }
        });
        setTimeout(() => writeFileSync(tmp.file, '# changed\n'), 100);
      });
      req.on('error', (e) => (String(e).includes('socket hang up') ? undefined : fail(e)));
      req.end();
      setTimeout(() => fail(new Error('no event within 5 s')), 5000);
    });
    expect(got).toMatch(/event: doc\ndata: \{"version":"[0-9a-f]+"\}/);
  });
});

describe('the first paint', () => {
  it('pointAssets points relative image sources at /__asset/ and leaves absolute, data and fragment ones', () => {
    // The rule of site/main.ts pointAssets, restated: a src without a scheme, a leading / or # is a file beside the document.
    expect(pointAssets('<p><img alt="a" src="fig.png"><img src="./sub/b.jpg" alt="b"></p>')).toBe('<p><img alt="a" src="/__asset/fig.png"><img src="/__asset/sub/b.jpg" alt="b"></p>');
    const kept = '<img src="/__asset/x.png"><img src="data:image/png;base64,AA"><img src="https://example.org/x.png"><img src="#x">';
    expect(pointAssets(kept)).toBe(kept);
    expect(pointAssets('<p>src="fig.png" in text</p>')).toBe('<p>src="fig.png" in text</p>');
  });

  it('inlinable: the renderer\'s sheet is written into the page; one holding a script or a frame-closing tag is not', () => {
    expect(inlinable('<article class="vb-sheet"><p>L = 4.8 m</p><style data-part="page-style">@page{}</style><main class="vb-main"><p>x</p></main></article>')).toBe(true);
    expect(inlinable('<article class="vb-sheet"><script>alert(1)</script></article>')).toBe(false);
    expect(inlinable('<article class="vb-sheet"><SCRIPT src=x></SCRIPT></article>')).toBe(false);
    expect(inlinable('<article class="vb-sheet"></main><p>outside</p></article>')).toBe(false);
    expect(inlinable('<p>not a sheet</p>')).toBe(false);
  });

  it('splitPage cuts the page inside #lv-sheet and refuses a page without it', () => {
    const html = '<!doctype html>\n<html>\n<head>\n  <title>t</title>\n</head>\n<body>\n  <main id="lv-sheet" class="lv-page"></main>\n</body>\n</html>\n';
    const cut = splitPage(html, '.a{}')!;
    expect(cut.head).toBe('<!doctype html>\n<html>\n<head>\n  <style id="lv-sheet-css">.a{}</style>\n  <title>t</title>\n</head>\n<body class="lv-waiting">\n  <main id="lv-sheet" class="lv-page">');
    expect(cut.tail).toBe('</main>\n</body>\n</html>\n');
    expect(splitPage(html.replace('id="lv-sheet"', 'id="other"'), '.a{}')).toBeNull();
    expect(splitPage(html, '.a{} </style><script>')).toBeNull();
  });
});
