/**
 * guardRequest: decides, before Vite sees a request, whether its path is one
 * the live sheet may serve. Everything not on the allow list is refused.
 *
 * Allowed:
 * - the app's own endpoints (`/__doc`, `/__write`);
 * - the document's assets, `/__asset/<path>`: image files inside the document's folder;
 * - Vite's virtual modules (`/@vite/…`, `/@id/__x00__…`);
 * - `/@fs/<absolute path>` only inside the allowed roots (app, engine, cells, node_modules, Vite cache);
 * - any other path only when it names an existing file inside the app folder (or is `/`).
 *
 * Paths are judged after following symbolic links, and refused outright when
 * any decoding of them (once, twice, three times) holds `..`, a backslash, a
 * NUL or another control character.
 */
import { realpathSync, statSync } from 'node:fs';
import { extname, isAbsolute, join, relative, resolve, sep } from 'node:path';

export interface GuardPolicy {
  /** The app folder (Vite's root). */
  appRoot: string;
  /** Folders whose files may be served through `/@fs/`. */
  allowRoots: string[];
  /** The document's folder: `/__asset/` paths resolve here. */
  docDir: string;
}

export type Verdict =
  | { ok: true; kind: 'api'; name: 'doc' | 'write' }
  | { ok: true; kind: 'asset'; file: string }
  | { ok: true; kind: 'app' }
  | { ok: false; status: 400 | 403 | 404; reason: string };

/** File types a document may show as figures. */
export const ASSET_TYPES: Record<string, string> = {
  '.png': 'image/png', '.jpg': 'image/jpeg', '.jpeg': 'image/jpeg', '.gif': 'image/gif',
  '.webp': 'image/webp', '.avif': 'image/avif', '.svg': 'image/svg+xml',
};

const refuse = (status: 400 | 403 | 404, reason: string): Verdict => ({ ok: false, status, reason });

/** Is `child` the folder `root` or inside it? Both must be real (symlink-free) absolute paths. */
export function isInside(root: string, child: string): boolean {
  const rel = relative(root, child);
  return rel === '' || (!rel.startsWith('..') && !isAbsolute(rel) && rel.split(sep)[0] !== '..');
}

function realOrNull(path: string): string | null {
  try {
    return realpathSync(path);
  } catch {
    return null;
  }
}

/**
 * The real path of `path`, or of its deepest existing ancestor with the rest
 * appended (a Vite cache file may be requested while it is still being written).
 */
function realOrAncestor(path: string): string | null {
  let head = resolve(path);
  const rest: string[] = [];
  for (;;) {
    const real = realOrNull(head);
    if (real) return join(real, ...rest.reverse());
    const up = resolve(head, '..');
    if (up === head) return null;
    rest.push(head.slice(up.length).replace(/^[/\\]/, ''));
    head = up;
  }
}

function isFile(path: string): boolean {
  try {
    return statSync(path).isFile();
  } catch {
    return false;
  }
}

/** Every decoding of the path, up to three levels deep; null if one is malformed. */
function decodings(path: string): string[] | null {
  const out = [path];
  for (let i = 0; i < 3; i++) {
    const last = out[out.length - 1]!;
    if (!last.includes('%')) break;
    try {
      out.push(decodeURIComponent(last));
    } catch {
      // A malformed escape at the first level is a bad request; deeper, it is just text.
      if (i === 0) return null;
      break;
    }
  }
  return out;
}

function looksHostile(p: string): string | null {
  if (/[\u0000-\u001f\u007f]/.test(p)) return 'control character in path';
  if (p.includes('\\')) return 'backslash in path';
  if (/(^|\/)\.\.(\/|$)/.test(p)) return '".." in path';
  if (p.startsWith('//')) return 'path starts with "//"';
  return null;
}

/**
 * Judges one request URL against the policy.
 * @param url the request's raw URL (path and query)
 * @example guardRequest('/%2e%2e/etc/passwd', policy) // {ok: false, status: 403, reason: '".." in path'}
 */
export function guardRequest(url: string, policy: GuardPolicy): Verdict {
  if (!url.startsWith('/')) return refuse(400, 'not a path');
  const rawPath = url.split(/[?#]/, 1)[0]!;
  const forms = decodings(rawPath);
  if (!forms) return refuse(400, 'malformed escape in path');
  for (const f of forms) {
    const why = looksHostile(f);
    if (why) return refuse(403, why);
  }
  // Query strings (?import, ?v=…) are Vite's; refuse NULs and traversal there too.
  const query = url.slice(rawPath.length);
  for (const f of decodings(query) ?? [query]) {
    if (/[\u0000]/.test(f) || /(^|[/=&?])\.\.([/&]|$)/.test(f)) return refuse(403, 'suspicious query');
  }
  const path = forms[1] ?? forms[0]!;

  if (path === '/__doc') return { ok: true, kind: 'api', name: 'doc' };
  if (path === '/__write') return { ok: true, kind: 'api', name: 'write' };
  if (path.startsWith('/__asset/')) return guardAsset(path.slice('/__asset/'.length), policy);
  if (path.startsWith('/@vite/') || path.startsWith('/@id/__x00__')) return { ok: true, kind: 'app' };
  if (path.startsWith('/@fs/')) {
    const real = realOrAncestor(path.slice('/@fs'.length));
    if (!real) return refuse(404, 'no such file');
    const roots = policy.allowRoots.map((r) => realOrNull(r)).filter((r): r is string => r !== null);
    return roots.some((r) => isInside(r, real)) ? { ok: true, kind: 'app' } : refuse(403, 'outside the allowed folders');
  }
  if (path === '/' || path === '/index.html') return { ok: true, kind: 'app' };
  const appRoot = realOrNull(policy.appRoot);
  const real = appRoot ? realOrNull(join(appRoot, path)) : null;
  if (!appRoot || !real || !isFile(real)) return refuse(404, 'no such file');
  return isInside(appRoot, real) ? { ok: true, kind: 'app' } : refuse(403, 'outside the app folder');
}

function guardAsset(rel: string, policy: GuardPolicy): Verdict {
  const type = ASSET_TYPES[extname(rel).toLowerCase()];
  if (!type) return refuse(403, 'not an image file');
  if (rel.split('/').some((part) => part.startsWith('.'))) return refuse(403, 'hidden file');
  const docDir = realOrNull(policy.docDir);
  const real = docDir ? realOrNull(resolve(docDir, rel)) : null;
  if (!docDir || !real || !isFile(real)) return refuse(404, 'no such file');
  return isInside(docDir, real) ? { ok: true, kind: 'asset', file: real } : refuse(403, "outside the document's folder");
}
