import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdirSync, mkdtempSync, realpathSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { guardRequest, isInside, type GuardPolicy } from '../../bin/serve/guard.js';

let root: string;
let policy: GuardPolicy;

beforeAll(() => {
  root = realpathSync(mkdtempSync(join(tmpdir(), 'vaultbook-guard-')));
  for (const d of ['app', 'lib', 'doc', 'outside']) mkdirSync(join(root, d));
  writeFileSync(join(root, 'app', 'main.ts'), 'export {}');
  writeFileSync(join(root, 'lib', 'a.ts'), 'export {}');
  writeFileSync(join(root, 'outside', 'secret.ts'), 'secret');
  writeFileSync(join(root, 'doc', 'fig.png'), 'png');
  symlinkSync(join(root, 'outside', 'secret.ts'), join(root, 'app', 'linked.ts'));
  symlinkSync(join(root, 'outside'), join(root, 'lib', 'out'));
  symlinkSync(join(root, 'lib', 'a.ts'), join(root, 'app', 'inner.ts'));
  policy = { appRoot: join(root, 'app'), allowRoots: [join(root, 'app'), join(root, 'lib')], docDir: join(root, 'doc') };
});

afterAll(() => rmSync(root, { recursive: true, force: true }));

describe('guardRequest', () => {
  it('guardRequest allows the app, the API, allowed /@fs/ files and images beside the document', () => {
    expect(guardRequest('/', policy)).toMatchObject({ ok: true, kind: 'app' });
    expect(guardRequest('/main.ts?t=123', policy)).toMatchObject({ ok: true, kind: 'app' });
    expect(guardRequest('/__doc', policy)).toEqual({ ok: true, kind: 'api', name: 'doc' });
    expect(guardRequest('/__write', policy)).toEqual({ ok: true, kind: 'api', name: 'write' });
    expect(guardRequest(`/@fs${root}/lib/a.ts?v=1`, policy)).toMatchObject({ ok: true });
    expect(guardRequest('/@vite/client', policy)).toMatchObject({ ok: true });
    expect(guardRequest('/__asset/fig.png', policy)).toEqual({ ok: true, kind: 'asset', file: join(root, 'doc', 'fig.png') });
  });

  it('guardRequest allows a file not yet written inside an allowed folder (a Vite cache file being optimised)', () => {
    expect(guardRequest(`/@fs${root}/lib/deps_temp/x.js`, policy)).toMatchObject({ ok: true });
    expect(guardRequest(`/@fs${root}/outside/deps_temp/x.js`, policy)).toMatchObject({ ok: false, status: 403 });
  });

  it('guardRequest follows symbolic links: inside stays allowed, pointing out is refused', () => {
    expect(guardRequest('/inner.ts', policy)).toMatchObject({ ok: false, status: 403 });
    expect(guardRequest('/linked.ts', policy)).toMatchObject({ ok: false, status: 403, reason: 'outside the app folder' });
    expect(guardRequest(`/@fs${root}/lib/out/secret.ts`, policy)).toMatchObject({ ok: false, status: 403 });
  });

  it('guardRequest refuses traversal in every encoding, NULs, backslashes and absolute paths', () => {
    for (const url of ['/../outside/secret.ts', '/%2e%2e/outside/secret.ts', '/%252e%252e/x', '/%25252E%25252E/x', '/.%2e/x',
      '/main.ts%00', '/main.ts\u0000', '/a\\..\\b', '//etc/passwd', `/@fs${root}/outside/secret.ts`, `${root}/outside/secret.ts`,
      '/__asset/%2e%2e/outside/secret.ts', `/__asset/${root}/doc/fig.png/../../outside/x.png`]) {
      const v = guardRequest(url, policy);
      expect(v.ok, url).toBe(false);
    }
  });

  it('isInside compares whole path segments', () => {
    expect(isInside('/a/b', '/a/b/c')).toBe(true);
    expect(isInside('/a/b', '/a/b')).toBe(true);
    expect(isInside('/a/b', '/a/bc')).toBe(false);
    expect(isInside('/a/b', '/a')).toBe(false);
  });
});
