/**
 * Shared by the serve tests: temp copies of documents, raw HTTP requests.
 */
import { mkdtempSync, copyFileSync, rmSync, realpathSync } from 'node:fs';
import { request } from 'node:http';
import { tmpdir } from 'node:os';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';

export const REPO = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
export const FIXTURES = join(REPO, 'test', 'serve', 'fixtures');

/** A fresh temp folder holding a copy of a fixture; returns the folder, the copy's path and a cleanup. */
export function tempCopy(fixture: string, name = 'calc.md'): { dir: string; file: string; cleanup: () => void } {
  const dir = realpathSync(mkdtempSync(join(tmpdir(), 'vaultbook-serve-')));
  const file = join(dir, name);
  copyFileSync(fixture, file);
  return { dir, file, cleanup: () => rmSync(dir, { recursive: true, force: true }) };
}

export interface RawResponse {
  status: number;
  body: string;
  headers: Record<string, string | string[] | undefined>;
}

/**
 * A request with the path sent exactly as given (fetch and URL would normalise `..` away).
 */
export function rawRequest(port: number, path: string, options: { method?: string; headers?: Record<string, string>; body?: string; host?: string } = {}): Promise<RawResponse> {
  return new Promise((ok, fail) => {
    const req = request({
      host: options.host ?? '127.0.0.1', port, path, method: options.method ?? 'GET',
      headers: { Host: `127.0.0.1:${port}`, ...options.headers },
      insecureHTTPParser: true,
    }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => ok({ status: res.statusCode ?? 0, body: Buffer.concat(chunks).toString('utf8'), headers: res.headers }));
    });
    req.on('error', fail);
    req.setTimeout(20_000, () => req.destroy(new Error(`timeout: ${path}`)));
    if (options.body !== undefined) req.write(options.body);
    req.end();
  });
}
