/**
 * The live page from a built bundle: `vite build` of site/ once, into
 * node_modules/.cache/vaultbook/site-<key>/, where the key is made from the
 * names, sizes and times of every file the page is built from (site/, engine/,
 * cells/, package-lock.json). It is reused until one of them changes, so
 * `serve` opens from a handful of files instead of the development server's
 * 141 modules. Builds go to a temporary folder renamed into place, so two
 * servers starting together never see half a build.
 *
 * Serving: only the files the build wrote (listed once at start) are served,
 * by exact path; `/__events` is a server-sent event stream that tells the page
 * when the document changed on disk (the development server's websocket does
 * that otherwise).
 *
 * The page itself (`/`) is sent in two parts: at once, everything before the
 * sheet (so the browser fetches the script and styles while the server is still
 * rendering), then the server-rendered sheet (first-paint.ts) written into
 * #lv-sheet, and the rest. The browser paints the sheet as soon as it arrives,
 * without waiting for the page's script.
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync } from 'node:fs';
import { extname, join, relative, sep } from 'node:path';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { siteConfig, REPO_ROOT } from './site-config.js';
import type { FirstPaint } from './first-paint.js';

const SOURCES = ['site', 'engine', 'cells'];
const KEEP_OLD_MS = 10 * 60 * 1000;
const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8', '.js': 'text/javascript; charset=utf-8', '.css': 'text/css; charset=utf-8',
  '.woff2': 'font/woff2', '.woff': 'font/woff', '.ttf': 'font/ttf', '.svg': 'image/svg+xml', '.png': 'image/png',
};

function listFiles(dir: string, out: string[] = []): string[] {
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) listFiles(path, out);
    else if (entry.isFile()) out.push(path);
  }
  return out;
}

/** The key of the sources as they are now: any added, removed or changed file changes it. */
export function sourceKey(root = REPO_ROOT): string {
  const hash = createHash('sha256');
  for (const dir of SOURCES) {
    for (const file of listFiles(join(root, dir)).sort()) {
      const s = statSync(file);
      hash.update(`${relative(root, file)}\0${s.size}\0${s.mtimeMs}\n`);
    }
  }
  const lock = join(root, 'package-lock.json');
  if (existsSync(lock)) hash.update(`lock\0${statSync(lock).mtimeMs}`);
  return hash.digest('hex').slice(0, 16);
}

/**
 * The folder of the built page for the current sources, building it when there is none.
 * @returns the folder and whether this call built it
 */
export async function buildSite(): Promise<{ dir: string; built: boolean; ms: number }> {
  const t0 = performance.now();
  const cache = join(REPO_ROOT, 'node_modules', '.cache', 'vaultbook');
  const dir = join(cache, `site-${sourceKey()}`);
  if (existsSync(join(dir, 'index.html'))) return { dir, built: false, ms: performance.now() - t0 };
  mkdirSync(cache, { recursive: true });
  const tmp = `${dir}.tmp-${process.pid}-${Date.now()}`;
  const { build } = await import('vite');
  const base = siteConfig();
  await build({ ...base, configFile: false, logLevel: 'error', build: { ...base.build, outDir: tmp, emptyOutDir: true } });
  try {
    renameSync(tmp, dir);
  } catch {
    rmSync(tmp, { recursive: true, force: true }); // another server finished the same build first
  }
  // Older builds are of no use once the sources moved on, except to a server still running from one:
  // those of the last ten minutes stay (as the command bundle's do).
  for (const old of readdirSync(cache)) {
    const path = join(cache, old);
    if (old.startsWith('site-') && path !== dir && Date.now() - statSync(path).mtimeMs > KEEP_OLD_MS) rmSync(path, { recursive: true, force: true });
  }
  return { dir, built: true, ms: performance.now() - t0 };
}

export interface BuiltSite {
  /** Serves the page's files and the event stream; false when the request is not for them. */
  handle(req: IncomingMessage, res: ServerResponse): boolean;
  /** Tells every open page that the document now has this version. */
  notify(version: string): void;
  close(): void;
}

/**
 * The built index.html cut where the server writes the sheet (inside #lv-sheet), with the sheet's
 * style sheet in the head (where the page would add it) and the body marked as waiting for the page's
 * own evaluation, as the page marks it itself.
 */
export function splitPage(html: string, css: string): { head: string; tail: string } | null {
  const sheet = /<main id="lv-sheet"[^>]*>/.exec(html);
  const head = /<head>/.exec(html);
  if (!sheet || !head || !/<body>/.test(html) || css.includes('</')) return null;
  const at = sheet.index + sheet[0].length;
  const before = html.slice(0, at)
    .replace('<body>', '<body class="lv-waiting">')
    .replace(/<head>\n?/, (h) => `${h}  <style id="lv-sheet-css">${css}</style>\n`);
  return { head: before, tail: html.slice(at) };
}

/**
 * May this sheet be written into the page's HTML? It is the renderer's sheet (prose cleaned of scripts),
 * but written into the page, unlike the page's own innerHTML, a <script> would run and a closing tag of
 * the page's frame would break out of #lv-sheet: such a sheet goes by /__sheet instead.
 */
export function inlinable(html: string): boolean {
  const count = (re: RegExp) => html.match(re)?.length ?? 0;
  return html.startsWith('<article') && !/<\/?(?:script|body|html|head|noscript|template|plaintext|xmp|iframe|frameset)\b/i.test(html)
    && count(/<main\b/gi) === count(/<\/main\b/gi); // the sheet's own <main> is closed inside it
}

/**
 * Serves a built page.
 * @param dir from buildSite
 * @param first the server-rendered sheet, served at /__sheet for the page's first paint
 */
export function serveBuiltSite(dir: string, first?: FirstPaint): BuiltSite {
  const files = new Map<string, string>();
  for (const file of listFiles(dir)) files.set(`/${relative(dir, file).split(sep).join('/')}`, file);
  files.set('/', join(dir, 'index.html'));
  const streams = new Set<ServerResponse>();
  const page = first ? splitPage(readFileSync(join(dir, 'index.html'), 'utf8'), first.css) : null;
  return {
    handle(req, res) {
      const url = req.url ?? '/';
      // The built page asks for its files without a query; anything else is for the guard to judge.
      if (url.includes('?') || url.includes('%')) return false;
      const path = url;
      if (path === '/__events') {
        res.writeHead(200, { 'Content-Type': 'text/event-stream', 'Cache-Control': 'no-store', Connection: 'keep-alive' });
        res.write(': connected\n\n');
        streams.add(res);
        req.on('close', () => streams.delete(res));
        return true;
      }
      if (path === '/__sheet' && first && req.method === 'GET') {
        first.get().then((sheet) => {
          res.writeHead(200, { 'Content-Type': 'application/json; charset=utf-8', 'Cache-Control': 'no-store', 'X-Content-Type-Options': 'nosniff' });
          res.end(JSON.stringify(sheet));
        }, (e: Error) => {
          res.writeHead(500, { 'Content-Type': 'text/plain; charset=utf-8' });
          res.end(`cannot render the sheet: ${e.message}`);
        });
        return true;
      }
      if ((path === '/' || path === '/index.html') && page && req.method === 'GET') {
        res.writeHead(200, { 'Content-Type': TYPES['.html']!, 'Cache-Control': 'no-store', 'X-Content-Type-Options': 'nosniff' });
        res.write(page.head);
        // Without a sheet (it could not be rendered, or is not one to write into a page) the page asks /__sheet itself.
        first!.get().then(({ html }) => res.end((inlinable(html) ? html : '') + page.tail), () => res.end(page.tail));
        return true;
      }
      const file = files.get(path);
      if (!file || (req.method !== 'GET' && req.method !== 'HEAD')) return false;
      // Hashed asset names never change; the page itself is checked each time.
      const cache = path.startsWith('/assets/') ? 'public, max-age=31536000, immutable' : 'no-store';
      res.writeHead(200, { 'Content-Type': TYPES[extname(file)] ?? 'application/octet-stream', 'Cache-Control': cache, 'X-Content-Type-Options': 'nosniff' });
      res.end(req.method === 'HEAD' ? undefined : readFileSync(file));
      return true;
    },
    notify(version) {
      for (const s of streams) s.write(`event: doc\ndata: ${JSON.stringify({ version })}\n\n`);
    },
    close() {
      for (const s of streams) s.end();
      streams.clear();
    },
  };
}
