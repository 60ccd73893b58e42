/**
 * startServer: the live sheet's server. The app (site/) and the engine run in the browser: by default
 * from the page built once and reused (built-site.ts), served by a plain Node server without loading
 * Vite at all; with `site: 'dev'` (or when the page cannot be built) from Vite's development server.
 * This server adds the document itself:
 *
 * - GET  /__doc           → {text, version, file} of the one document it was started with;
 * - POST /__write         → writes changed input values into that document (and nowhere else);
 * - GET  /__asset/<path>  → an image beside the document;
 * - a `doc` event on /__events (built page) or `vaultbook:doc` on Vite's websocket whenever the file changes on disk.
 *
 * It listens on 127.0.0.1 only, and a guard in front of everything else refuses every
 * path outside the allow list (see guard.ts); the built page serves nothing but its own files.
 */
import { realpathSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { createServer as createHttpServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Plugin, ViteDevServer } from 'vite';
import { siteConfig, REPO_ROOT } from './site-config.js';
import { guardRequest, ASSET_TYPES, type GuardPolicy } from './guard.js';
import { rewriteGivenValues, RewriteError } from './rewrite.js';
import { wrongDimension } from './dimension.js';
import { replaceIfUnchanged, removeStaleTemps } from './atomic.js';
import { watchDocument, type DocumentWatch } from './watch.js';
import { versionOf } from './version.js';
import { buildSite, serveBuiltSite, type BuiltSite } from './built-site.js';
import { firstPaint, type FirstPaint } from './first-paint.js';
import { DocumentError, decodeDocument, readDocumentBytesSync } from '../document.js';
import { sharedArchive } from '../git.js';

export interface ServeOptions {
  /** The calc document to serve (and the only file ever written). */
  file: string;
  /** Port; 0 picks a free one. Default 4780. */
  port?: number;
  /** Fail instead of trying the next port when `port` is taken. */
  strictPort?: boolean;
  /** Vite's log level (default 'warn'). */
  logLevel?: 'info' | 'warn' | 'error' | 'silent';
  /** Watcher timings, for tests. */
  watch?: { debounceMs?: number; pollMs?: number };
  /** `--case NAME`: the case the page shows first (its inputs set as trial values). */
  case?: string;
  /** 'built' (default): the page from a bundle built once and reused (built-site.ts); 'dev': Vite's development server. */
  site?: 'built' | 'dev';
}

export interface ServeHandle {
  /** http://127.0.0.1:PORT/ */
  url: string;
  port: number;
  /** The document's real path. */
  file: string;
  /** The listening server (its address is the one the page is served on). */
  httpServer: Server;
  /** The development server, only when the page comes from it (`site: 'dev'`, or the page could not be built). */
  vite: ViteDevServer | null;
  /** Settles once the sheet's first paint has been rendered (or failed); at once for the development server. */
  rendered: Promise<void>;
  close(): Promise<void>;
}

/** Body of a POST /__write. */
export interface WriteRequest {
  /** The version of the document the page loaded. */
  version: string;
  /** Input name → new value text. */
  values: Record<string, string>;
}

const MAX_BODY = 1 << 20;

function sendJson(res: ServerResponse, status: number, body: unknown): void {
  const text = JSON.stringify(body);
  res.writeHead(status, { 'Content-Type': 'application/json; charset=utf-8', 'Cache-Control': 'no-store', 'X-Content-Type-Options': 'nosniff' });
  res.end(text);
}

function readBody(req: IncomingMessage): Promise<string> {
  return new Promise((ok, fail) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on('data', (c: Buffer) => {
      size += c.length;
      if (size > MAX_BODY) {
        fail(new Error('request too large'));
        req.destroy();
      } else chunks.push(c);
    });
    req.on('end', () => ok(Buffer.concat(chunks).toString('utf8')));
    req.on('error', fail);
  });
}

function isWriteRequest(v: unknown): v is WriteRequest {
  if (typeof v !== 'object' || v === null) return false;
  const r = v as WriteRequest;
  return typeof r.version === 'string' && typeof r.values === 'object' && r.values !== null
    && Object.values(r.values).every((x) => typeof x === 'string');
}

/** Does the text decode and re-encode to exactly these bytes? Otherwise a rewrite could alter other bytes. */
function roundTrips(bytes: Buffer, text: string): boolean {
  return Buffer.from(text, 'utf8').equals(bytes);
}

/**
 * Listens on 127.0.0.1, from `port` upwards while a port is taken (unless `strict`), as Vite's own server does.
 * @returns the port listened on
 */
function listenLocal(server: Server, port: number, strict: boolean): Promise<number> {
  return new Promise((ok, fail) => {
    const attempt = (p: number) => {
      const onError = (e: NodeJS.ErrnoException) => {
        server.off('listening', onListening);
        if (e.code === 'EADDRINUSE' && !strict && p !== 0 && p < 65535) attempt(p + 1);
        else fail(e);
      };
      const onListening = () => {
        server.off('error', onError);
        ok((server.address() as AddressInfo).port);
      };
      server.once('error', onError);
      server.once('listening', onListening);
      server.listen(p, '127.0.0.1');
    };
    attempt(port);
  });
}

/**
 * Starts the live sheet for one document.
 * @example const s = await startServer({file: 'calc.md', port: 0}); console.log(s.url); … await s.close()
 */
export async function startServer(options: ServeOptions): Promise<ServeHandle> {
  const file = realpathSync(options.file);
  // A regular UTF-8 text file within the size limit, or a DocumentError saying why not.
  decodeDocument(options.file, readDocumentBytesSync(file));
  const shownName = options.file;
  const docDir = dirname(file);
  removeStaleTemps(file);
  let port = 0;
  const hostOk = (host: string | undefined) => host === `127.0.0.1:${port}` || host === `localhost:${port}`;
  const originOk = (origin: string | undefined) => origin === undefined || origin === `http://127.0.0.1:${port}` || origin === `http://localhost:${port}`;
  /**
   * Only the page's own origin may read the document, its images or the sources: a page on another
   * origin (another localhost port included: same site, other origin) is refused whatever it asks.
   * Browsers say where a request comes from in Sec-Fetch-Site and, for cross-origin reads, Origin;
   * a request with neither (a typed address, curl) comes from the user.
   */
  const fromThisPage = (req: IncomingMessage) => {
    const site = req.headers['sec-fetch-site'];
    if (site !== undefined && site !== 'same-origin' && site !== 'none') return false;
    return originOk(req.headers.origin);
  };
  // At most one git process at a time for the footer, shared by all requests waiting for it.
  const archive = sharedArchive(file);
  const policy: GuardPolicy = {
    appRoot: join(REPO_ROOT, 'site'),
    allowRoots: [join(REPO_ROOT, 'site'), join(REPO_ROOT, 'engine'), join(REPO_ROOT, 'cells'), join(REPO_ROOT, 'node_modules')],
    docDir,
  };
  let watcher: DocumentWatch | null = null;
  // The page from a built bundle when it can be built; else from the development server, as before.
  let site: BuiltSite | null = null;
  let first: FirstPaint | null = null;
  if ((options.site ?? 'built') === 'built') {
    try {
      first = firstPaint(file, shownName, options.case);
      site = serveBuiltSite((await buildSite()).dir, first);
    } catch (e) {
      console.warn(`vaultbook serve: could not build the page (${(e as Error).message}); serving it from the development server`);
    }
  }

  const readDoc = () => {
    const bytes = readDocumentBytesSync(file);
    return { bytes, text: decodeDocument(shownName, bytes), version: versionOf(bytes) };
  };

  const write = async (req: IncomingMessage, res: ServerResponse) => {
    if (req.method !== 'POST') return sendJson(res, 405, { ok: false, message: 'use POST' });
    if (!originOk(req.headers.origin)) return sendJson(res, 403, { ok: false, message: 'refused: the request did not come from this page' });
    if (!/^application\/json\b/.test(req.headers['content-type'] ?? '')) return sendJson(res, 415, { ok: false, message: 'expected application/json' });
    let body: unknown;
    try {
      body = JSON.parse(await readBody(req));
    } catch (e) {
      return sendJson(res, 400, { ok: false, message: `cannot read the request: ${(e as Error).message}` });
    }
    if (!isWriteRequest(body)) return sendJson(res, 400, { ok: false, message: 'expected {version, values: {name: text}}' });
    // From here to the rename everything is synchronous, so no other write of this server can interleave.
    // An editor in another process can: replaceIfUnchanged judges the bytes on disk again at the
    // moment of replacing them, and after.
    let current;
    try {
      current = readDoc();
    } catch (e) {
      if (e instanceof DocumentError) return sendJson(res, 422, { ok: false, message: `${e.message}; nothing was written` });
      throw e;
    }
    const conflict = (version: string) => sendJson(res, 409, {
      ok: false, conflict: true, version,
      message: `${shownName} changed on disk since this page loaded it; nothing was written. Load the new version (your changed inputs are kept where they still exist) and write again.`,
    });
    if (current.version !== body.version) return conflict(current.version);
    if (!roundTrips(current.bytes, current.text)) {
      return sendJson(res, 422, { ok: false, message: `${shownName} is not valid UTF-8 text; nothing was written` });
    }
    const refusal = wrongDimension(current.text, body.values);
    if (refusal) return sendJson(res, 422, { ok: false, message: refusal });
    let result;
    try {
      result = rewriteGivenValues(current.text, body.values);
    } catch (e) {
      if (e instanceof RewriteError) return sendJson(res, 400, { ok: false, message: e.message });
      throw e;
    }
    if (result.changed.length === 0) return sendJson(res, 200, { ok: true, version: current.version, changed: [], notes: [], text: current.text });
    const bytes = Buffer.from(result.text, 'utf8');
    if (replaceIfUnchanged(file, bytes, (onDisk) => versionOf(onDisk) === body.version) === 'changed') {
      let now = '';
      try { now = versionOf(readDocumentBytesSync(file)); } catch { /* mid-save; the page reloads on the watch event */ }
      return conflict(now);
    }
    const version = versionOf(bytes);
    watcher?.known(version);
    return sendJson(res, 200, { ok: true, version, changed: result.changed, notes: result.notes, text: result.text, archive: await archive(bytes) });
  };

  /** Every request passes here first: the Host and origin checks, the built page, then the guard. */
  const handle = (req: IncomingMessage, res: ServerResponse, next: () => void): void => {
    const url = req.url ?? '/';
    if (!hostOk(req.headers.host)) {
      res.writeHead(403, { 'Content-Type': 'text/plain' }).end('refused: unexpected Host header');
      return;
    }
    if (!fromThisPage(req)) {
      res.writeHead(403, { 'Content-Type': 'text/plain', Vary: 'Origin, Sec-Fetch-Site' }).end('refused: only the live sheet itself may read from this server');
      return;
    }
    if (site?.handle(req, res)) return;
    const verdict = guardRequest(url, policy);
    if (!verdict.ok) {
      res.writeHead(verdict.status, { 'Content-Type': 'text/plain; charset=utf-8' }).end(`refused: ${verdict.reason}`);
      return;
    }
    if (verdict.kind === 'app') return next();
    if (verdict.kind === 'asset') {
      const type = ASSET_TYPES[verdict.file.slice(verdict.file.lastIndexOf('.')).toLowerCase()]!;
      let image: Buffer;
      try {
        image = readDocumentBytesSync(verdict.file);
      } catch (e) {
        res.writeHead(404, { 'Content-Type': 'text/plain; charset=utf-8' }).end(`refused: ${e instanceof DocumentError ? e.reason : 'cannot read the file'}`);
        return;
      }
      res.writeHead(200, { 'Content-Type': type, 'X-Content-Type-Options': 'nosniff', 'Content-Security-Policy': "default-src 'none'; style-src 'unsafe-inline'", 'Cache-Control': 'no-store' });
      res.end(image);
      return;
    }
    if (verdict.name === 'doc') {
      if (req.method !== 'GET' && req.method !== 'HEAD') return sendJson(res, 405, { ok: false, message: 'use GET' });
      let d;
      try {
        d = readDoc();
      } catch (e) {
        if (e instanceof DocumentError) return sendJson(res, 422, { ok: false, message: e.message });
        throw e;
      }
      // The same archive identification `vaultbook render` prints in the sheet's footer.
      void archive(d.bytes).then((info) => sendJson(res, 200, { text: d.text, version: d.version, file: shownName, name: basename(file), archive: info, ...(options.case !== undefined ? { case: options.case } : {}) }));
      return;
    }
    write(req, res).catch((e) => sendJson(res, 500, { ok: false, message: `writing ${shownName} failed: ${(e as Error).message}; the file on disk is unchanged` }));
  };

  let vite: ViteDevServer | null = null;
  let httpServer: Server;
  let rendered = Promise.resolve();
  if (site) {
    // The built page: a plain server. Anything the guard lets through that is not one of the page's
    // own files (the sources Vite would serve) is not served at all.
    httpServer = createHttpServer((req, res) => handle(req, res, () => {
      res.writeHead(404, { 'Content-Type': 'text/plain; charset=utf-8' }).end('refused: not part of the built page');
    }));
    port = await listenLocal(httpServer, options.port ?? 4780, options.strictPort ?? false);
    // Rendered now that the address is known: a browser connecting meanwhile gets the page's head at once.
    rendered = first!.get().then(() => undefined, () => undefined);
  } else {
    const plugin: Plugin = {
      name: 'vaultbook-serve',
      configureServer(server) {
        // Registered directly (not returned), so it runs before every Vite middleware.
        server.middlewares.use(handle);
      },
    };
    const base = siteConfig();
    // Loaded only for the development server: the built page, and every other command, start without it.
    const { createServer } = await import('vite');
    vite = await createServer({
      ...base,
      configFile: false,
      logLevel: options.logLevel ?? 'warn',
      plugins: [...(base.plugins ?? []), plugin],
      server: {
        ...base.server,
        host: '127.0.0.1',
        // No CORS headers at all: the page reads only from its own origin, which needs none.
        cors: false,
        port: options.port ?? 4780,
        strictPort: options.strictPort ?? false,
        open: false,
      },
    });
    await vite.listen();
    httpServer = vite.httpServer as Server;
    port = (httpServer.address() as AddressInfo).port;
  }
  const initial = readDoc();
  watcher = watchDocument(file, initial.version, (_bytes, version) => {
    vite?.ws.send({ type: 'custom', event: 'vaultbook:doc', data: { version } });
    site?.notify(version);
  }, options.watch);
  return {
    url: `http://127.0.0.1:${port}/`,
    port,
    file,
    httpServer,
    vite,
    rendered,
    close: async () => {
      watcher?.close();
      site?.close();
      if (vite) await vite.close();
      else {
        const closed = new Promise<void>((ok) => httpServer.close(() => ok()));
        httpServer.closeAllConnections();
        await closed;
      }
    },
  };
}
