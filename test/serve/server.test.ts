import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { connect } from 'node:net';
import { mkdirSync, readFileSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { startServer, type ServeHandle } from '../../bin/serve/server.js';
import { versionOf } from '../../bin/serve/version.js';
import { FIXTURES, REPO, rawRequest, tempCopy } from './helpers.js';

const SECRET = 'TOP-SECRET-MARKER-4f1c';

// Both ways of serving the page: the built page (a plain server, the default) and Vite's development
// server behind the same guard. Every refusal below must hold for each.
describe.each(['built', 'dev'] as const)('startServer (%s page)', (site) => {
  let server: ServeHandle;
  let tmp: ReturnType<typeof tempCopy>;

  beforeAll(async () => {
    // calc.md sits in <tmp>/doc; a secret sits beside that folder and is linked from inside it.
    tmp = tempCopy(join(FIXTURES, 'barrel.md'), 'seed.md');
    mkdirSync(join(tmp.dir, 'doc'));
    writeFileSync(join(tmp.dir, 'doc', 'calc.md'), readFileSync(tmp.file));
    writeFileSync(join(tmp.dir, 'secret.png'), SECRET);
    writeFileSync(join(tmp.dir, 'secret.txt'), SECRET);
    writeFileSync(join(tmp.dir, 'doc', 'figure.png'), 'PNGDATA');
    writeFileSync(join(tmp.dir, 'doc', '.hidden.png'), SECRET);
    symlinkSync(join(tmp.dir, 'secret.png'), join(tmp.dir, 'doc', 'leak.png'));
    symlinkSync(tmp.dir, join(tmp.dir, 'doc', 'up'));
    server = await startServer({ file: join(tmp.dir, 'doc', 'calc.md'), port: 0, logLevel: 'silent', site });
  }, 120_000);

  afterAll(async () => {
    await server?.close();
    tmp?.cleanup();
  });

  it('startServer listens on 127.0.0.1 only: the listening socket\'s own address, and a loopback connection answers', async () => {
    // Read from the socket itself: no traffic to any other address is needed to know where it listens.
    const address = server.httpServer.address();
    expect(address).toMatchObject({ address: '127.0.0.1', family: 'IPv4', port: server.port });
    expect(server.url).toBe(`http://127.0.0.1:${server.port}/`);
    expect((await rawRequest(server.port, '/__doc')).status).toBe(200);
    // Vite runs only for the development server.
    expect(server.vite === null).toBe(site === 'built');
  });

  it('GET /__doc gives the text, the version of its bytes and the file name', async () => {
    const r = await rawRequest(server.port, '/__doc');
    const body = JSON.parse(r.body);
    const bytes = readFileSync(join(tmp.dir, 'doc', 'calc.md'));
    expect(body.text).toBe(bytes.toString('utf8'));
    expect(body.version).toBe(versionOf(bytes));
    expect(r.headers['cache-control']).toBe('no-store');
  });

  it(site === 'dev' ? 'serves the app, the engine through /@fs/ and an image beside the document' : 'serves the page and an image beside the document, and no source file', async () => {
    expect((await rawRequest(server.port, '/')).status).toBe(200);
    // The built page needs none of the sources the development server compiles on request.
    const sources = site === 'dev' ? 200 : 404;
    expect((await rawRequest(server.port, '/main.ts')).status).toBe(sources);
    expect((await rawRequest(server.port, `/@fs${REPO}/engine/index.ts`)).status).toBe(sources);
    const img = await rawRequest(server.port, '/__asset/figure.png');
    expect([img.status, img.body, img.headers['content-type']]).toEqual([200, 'PNGDATA', 'image/png']);
  });

  const hostile: Array<[string, string]> = [
    ['dot-dot', '/../package.json'],
    ['dot-dot deep', '/main.ts/../../package.json'],
    ['encoded dot-dot', '/%2e%2e/package.json'],
    ['encoded slash', '/..%2fpackage.json'],
    ['encoded both', '/%2e%2e%2f%2e%2e%2fpackage.json'],
    ['double-encoded', '/%252e%252e/%252e%252e/package.json'],
    ['triple-encoded', '/%25252e%25252e%25252fpackage.json'],
    ['backslash', '/..\\package.json'],
    ['encoded backslash', '/%5c..%5cpackage.json'],
    ['NUL', '/main.ts%00.png'],
    ['double-encoded NUL', '/main.ts%2500'],
    ['absolute path as url', `${REPO}/package.json`],
    ['absolute path, system', '/etc/passwd'],
    ['protocol-relative', '//etc/passwd'],
    ['@fs outside', '/@fs/etc/passwd'],
    ['@fs repo root', `/@fs${REPO}/package.json`],
    ['@fs dot-dot', `/@fs${REPO}/engine/../package.json`],
    ['@fs temp secret', '/@fs/TMP/secret.txt'],
    ['@fs ?raw', `/@fs${REPO}/package.json?raw`],
    ['@fs ?import&raw', `/@fs${REPO}/package.json?import&raw`],
    ['asset dot-dot', '/__asset/../secret.png'],
    ['asset encoded dot-dot', '/__asset/%2e%2e/secret.png'],
    ['asset symlink to a file outside', '/__asset/leak.png'],
    ['asset symlinked folder outside', '/__asset/up/secret.png'],
    ['asset hidden file', '/__asset/.hidden.png'],
    ['asset not an image', '/__asset/calc.md'],
    ['asset absolute', '/__asset//etc/passwd'],
    ['asset absolute image', '/__asset/TMP/secret.png'],
    ['the git folder', '/.git/config'],
    ['vite id of a file', `/@id/${REPO}/package.json`],
    ['query traversal', '/index.html?../../package.json'],
    ['malformed escape', '/%E0%A4%A'],
  ];

  for (const [what, path] of hostile) {
    it(`refuses a path outside the allow list: ${what}`, async () => {
      const p = path.replace('/TMP/', `/${tmp.dir}/`).replace('/@fs//', '/@fs/');
      const r = await rawRequest(server.port, p);
      expect(r.status, `${p} → ${r.status} ${r.body.slice(0, 80)}`).toBeGreaterThanOrEqual(400);
      expect(r.body).not.toContain(SECRET);
      expect(r.body).not.toContain('"devDependencies"');
      expect(r.body).not.toContain('root:');
    });
  }

  it('refuses a raw NUL byte in the request line', async () => {
    const reply = await new Promise<string>((ok) => {
      const s = connect({ host: '127.0.0.1', port: server.port }, () => s.write(`GET /main.ts\u0000.png HTTP/1.1\r\nHost: 127.0.0.1:${server.port}\r\n\r\n`));
      let data = '';
      s.on('data', (d) => { data += d.toString(); });
      s.on('close', () => ok(data));
      s.on('error', () => ok(data));
      setTimeout(() => s.destroy(), 3000);
    });
    expect(reply).not.toMatch(/^HTTP\/1\.1 200/);
    expect(reply).not.toContain('createServer');
  });

  it('refuses a request with a foreign Host header (DNS rebinding)', async () => {
    const r = await rawRequest(server.port, '/__doc', { headers: { Host: 'evil.example' } });
    expect(r.status).toBe(403);
  });

  it('POST /__write refuses another origin, a wrong content type and a bad body', async () => {
    const body = JSON.stringify({ version: 'x', values: { L: '5 m' } });
    const json = { 'Content-Type': 'application/json' };
    expect((await rawRequest(server.port, '/__write', { method: 'POST', body, headers: { ...json, Origin: 'http://evil.example' } })).status).toBe(403);
    expect((await rawRequest(server.port, '/__write', { method: 'POST', body, headers: { 'Content-Type': 'text/plain' } })).status).toBe(415);
    expect((await rawRequest(server.port, '/__write', { method: 'POST', body: '{nope', headers: json })).status).toBe(400);
    expect((await rawRequest(server.port, '/__write', { method: 'GET' })).status).toBe(405);
  });

  it('POST /__write with a stale version is refused as a conflict and writes nothing', async () => {
    const file = join(tmp.dir, 'doc', 'calc.md');
    const before = readFileSync(file);
    const r = await rawRequest(server.port, '/__write', {
      method: 'POST', headers: { 'Content-Type': 'application/json', Origin: `http://127.0.0.1:${server.port}` },
      body: JSON.stringify({ version: versionOf('an older text'), values: { L: '5 m' } }),
    });
    expect(r.status).toBe(409);
    expect(JSON.parse(r.body)).toMatchObject({ ok: false, conflict: true, version: versionOf(before) });
    expect(JSON.parse(r.body).message).toMatch(/changed on disk since this page loaded it; nothing was written/);
    expect(readFileSync(file).equals(before)).toBe(true);
  });

  it('POST /__write rewrites only the value text and answers the new version', async () => {
    const file = join(tmp.dir, 'doc', 'calc.md');
    const before = readFileSync(file, 'utf8');
    const r = await rawRequest(server.port, '/__write', {
      method: 'POST', headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ version: versionOf(before), values: { L: '5.2 m', t: '0.25 m' } }),
    });
    const body = JSON.parse(r.body);
    expect(r.status).toBe(200);
    const after = readFileSync(file, 'utf8');
    expect(after).toBe(before.replace('L = 4.8 m             #', 'L = 5.2 m             #').replace('t = 0.23 m            #', 't = 0.25 m            #'));
    expect(body).toMatchObject({ ok: true, changed: ['L', 't'], version: versionOf(after), text: after });
    // Bad values are refused with the reason, and nothing changes.
    const bad = await rawRequest(server.port, '/__write', {
      method: 'POST', headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ version: versionOf(after), values: { H: '1 kN/m' } }),
    });
    expect(bad.status).toBe(400);
    expect(JSON.parse(bad.body).message).toMatch(/"H" is a calc value/);
    expect(readFileSync(file, 'utf8')).toBe(after);
    // A value without the input's dimension, or a bare number, is refused too (the page refuses them first).
    for (const [values, why] of [[{ t: '3 kN' }, /t is length \(m\); "3 kN" is force \(kN\)\. Nothing was written/], [{ t: '0.215' }, /"0.215" has no unit; write it as "0.215 m"/]] as const) {
      const r2 = await rawRequest(server.port, '/__write', {
        method: 'POST', headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ version: versionOf(after), values }),
      });
      expect(r2.status).toBe(422);
      expect(JSON.parse(r2.body).message).toMatch(why);
      expect(readFileSync(file, 'utf8')).toBe(after);
    }
  });

  describe('only the page\'s own origin may read', () => {
    const other = () => `http://127.0.0.1:${server.port === 65535 ? 65534 : server.port + 1}`;
    const refusedFrom = async (path: string, headers: Record<string, string>) => {
      const r = await rawRequest(server.port, path, { headers });
      expect(r.status, `${path} ${JSON.stringify(headers)}`).toBe(403);
      expect(r.headers['access-control-allow-origin']).toBeUndefined();
      expect(r.body).not.toContain('Fictional');
    };

    it('GET /__doc from another localhost port is refused, with no CORS header (Origin, or Sec-Fetch-Site: same-site)', async () => {
      await refusedFrom('/__doc', { Origin: other(), 'Sec-Fetch-Site': 'same-site', 'Sec-Fetch-Mode': 'cors' });
      await refusedFrom('/__doc', { Origin: `http://localhost:${server.port + 1}` });
      await refusedFrom('/__doc', { 'Sec-Fetch-Site': 'same-site' });
      await refusedFrom('/__doc', { 'Sec-Fetch-Site': 'cross-site' });
      await refusedFrom('/__doc', { Origin: 'null' });
    });

    it('the sources, the images and a CORS preflight from another origin are refused too', async () => {
      await refusedFrom('/main.ts', { Origin: other(), 'Sec-Fetch-Site': 'same-site' });
      await refusedFrom(`/@fs${REPO}/engine/index.ts`, { 'Sec-Fetch-Site': 'same-site', 'Sec-Fetch-Mode': 'no-cors' });
      await refusedFrom('/__asset/figure.png', { 'Sec-Fetch-Site': 'cross-site' });
      const pre = await rawRequest(server.port, '/__doc', { method: 'OPTIONS', headers: { Origin: other(), 'Access-Control-Request-Method': 'GET' } });
      expect(pre.status).toBe(403);
      expect(pre.headers['access-control-allow-origin']).toBeUndefined();
    });

    it('the page itself (same origin, or a typed address) reads the document', async () => {
      const own = await rawRequest(server.port, '/__doc', { headers: { Origin: `http://127.0.0.1:${server.port}`, 'Sec-Fetch-Site': 'same-origin' } });
      expect(own.status).toBe(200);
      expect(own.headers['access-control-allow-origin']).toBeUndefined();
      expect((await rawRequest(server.port, '/', { headers: { 'Sec-Fetch-Site': 'none', 'Sec-Fetch-Mode': 'navigate' } })).status).toBe(200);
    });
  });
});
