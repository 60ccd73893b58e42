// Builds the command line into one bundle with esbuild, so that a cold `vaultbook` start loads a
// few files instead of thousands of modules through a TypeScript loader. Bundles live in
// node_modules/.cache/vaultbook/<build>/ (never committed); the file `current` names the newest.
// A build is never changed once written, so processes running side by side cannot break each
// other; a new one is made whenever a source file is newer than the current build.
import { readdirSync, statSync, existsSync, mkdirSync, writeFileSync, renameSync, rmSync, readFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { createRequire } from 'node:module';
import vm from 'node:vm';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const cache = join(root, 'node_modules', '.cache', 'vaultbook');
const pointer = join(cache, 'current');
const SOURCES = ['engine', 'cells', 'bin', 'site'];
const KEEP_OLD_MS = 10 * 60 * 1000;

// mathjs's main entry builds a complete default instance when it is imported (~0.4 s), and
// cells/math.ts then builds its own. The engine needs only `create` and the factory list `all`,
// so the bundle takes those two from mathjs's own files and skips the default instance.
const MATHJS_CORE = join(root, 'node_modules', 'mathjs', 'lib', 'esm');
const mathjsCore = {
  name: 'mathjs-core',
  setup(b) {
    b.onResolve({ filter: /^mathjs$/ }, () => ({ path: 'mathjs-core', namespace: 'vaultbook' }));
    b.onLoad({ filter: /^mathjs-core$/, namespace: 'vaultbook' }, () => ({
      contents: `export { create } from ${JSON.stringify(join(MATHJS_CORE, 'core', 'create.js'))};\n`
        + `export { all } from ${JSON.stringify(join(MATHJS_CORE, 'entry', 'allFactoriesAny.js'))};\n`,
      resolveDir: MATHJS_CORE,
    }));
  },
};

// Packages that load their own files or binaries at run time stay in node_modules.
const EXTERNAL = ['vite', 'playwright-core', 'esbuild', 'tsx', 'fsevents', 'lightningcss'];

/** Newest modification time of the sources and the package files (ms). */
function newestSource() {
  let newest = 0;
  const walk = (dir) => {
    for (const d of readdirSync(dir, { withFileTypes: true })) {
      const p = join(dir, d.name);
      if (d.isDirectory()) walk(p);
      else if (/\.(ts|js|css|json)$/.test(d.name)) newest = Math.max(newest, statSync(p).mtimeMs);
    }
  };
  for (const s of SOURCES) if (existsSync(join(root, s))) walk(join(root, s));
  for (const f of ['package-lock.json', 'package.json']) if (existsSync(join(root, f))) newest = Math.max(newest, statSync(join(root, f)).mtimeMs);
  return newest;
}

/**
 * The current build: {entry, builtAt} or null. A build made for another folder is not current:
 * it has that folder's paths written in (a checkout moved or copied with its node_modules).
 */
function currentBuild() {
  try {
    const { dir, builtAt, builtFor } = JSON.parse(readFileSync(pointer, 'utf8'));
    const entry = join(cache, dir, 'cli.cjs');
    return builtFor === root && existsSync(entry) ? { entry, builtAt } : null;
  } catch {
    return null;
  }
}

// Our own files refer to their neighbours through import.meta.url (the templates folder, katex's
// files, the worker entry). In a bundle that URL would name the bundle, so each file gets its own
// source URL written in at build time.
const OWN_FILES = new RegExp(`^${root.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}[\\/](?:${SOURCES.join('|')})[\\/].*\\.[tj]s$`);
const sourceUrls = {
  name: 'source-urls',
  setup(b) {
    b.onLoad({ filter: OWN_FILES }, (a) => ({
      // A function as the replacement, so that a $ in the path is taken as it is.
      contents: readFileSync(a.path, 'utf8').replaceAll('import.meta.url', () => JSON.stringify(pathToFileURL(a.path).href)),
      loader: a.path.endsWith('.ts') ? 'ts' : 'js',
    }));
  },
};

/** Builds a new bundle, points `current` at it, and returns its entry path. */
export async function buildBundle() {
  const builtAt = Date.now();
  const dir = `build-${builtAt}-${process.pid}`;
  const outdir = join(cache, dir);
  mkdirSync(cache, { recursive: true });
  // esbuild is loaded only when a build is needed, not on every start.
  const { build } = await import('esbuild');
  await build({
    // The command line and its workers, each a file of its own (bin/worker-url.ts finds
    // them in the folder named by __VAULTBOOK_BUNDLE__).
    entryPoints: {
      cli: join(root, 'bin', 'cli.ts'),
      'archive-worker': join(root, 'bin', 'archive', 'worker.ts'),
      'explain-worker': join(root, 'bin', 'explain', 'worker.ts'),
    },
    define: { __VAULTBOOK_BUNDLE__: JSON.stringify(outdir) },
    // CommonJS, so that loadBundle can hand V8 a code cache (Node 20 has none for ES modules).
    bundle: true, format: 'cjs', platform: 'node', target: 'node20',
    // Template literals become plain strings, which esbuild writes in ASCII; left as they are, the
    // raw text of a tagged one (String.raw`…`) could keep characters that asciiOnly cannot touch.
    supported: { 'template-literal': false },
    outdir, outExtension: { '.js': '.cjs' }, logLevel: 'error', legalComments: 'none',
    // Smaller text parses faster at every start; names are kept for messages and stack traces.
    minifyWhitespace: true, minifySyntax: true,
    // Our code imports the packages left outside with import(), which the bundle keeps.
    external: EXTERNAL,
    plugins: [sourceUrls, ...(existsSync(join(MATHJS_CORE, 'core', 'create.js')) ? [mathjsCore] : [])],
  });
  for (const f of readdirSync(outdir)) {
    const file = join(outdir, f);
    let text = readFileSync(file, 'utf8');
    if (f === 'cli.cjs') text = routeImports(text);
    writeFileSync(file, asciiOnly(text));
  }
  const tmp = `${pointer}.${process.pid}`;
  writeFileSync(tmp, JSON.stringify({ dir, builtAt, builtFor: root }));
  renameSync(tmp, pointer);
  retireOldBuilds(dir);
  return join(outdir, 'cli.cjs');
}

/**
 * In the command line's bundle, import() of an outside package becomes a call of the importer that
 * loadBundle passes in: V8 drops the import() callback of functions it restores from a code cache,
 * so an import() left in would fail on the second run. Any other import() fails the build.
 */
export function routeImports(text) {
  for (const name of EXTERNAL) text = text.replaceAll(`import(${JSON.stringify(name)})`, `__vaultbookImport(${JSON.stringify(name)})`);
  const left = /(?<![.\w$"'`])import\s*\(/.exec(text);
  if (left) throw new Error(`the bundle keeps an import() that the code cache would break: …${text.slice(Math.max(0, left.index - 60), left.index + 40)}…`);
  return text;
}

/**
 * esbuild writes non-ASCII text as escapes except inside regular expressions; a handful there make
 * Node decode the whole bundle into a two-byte string, slower at every start. In a regular
 * expression \uXXXX means the character itself, with or without the u flag (a pair of escaped
 * surrogates is one code point under u); a character escaped by a backslash (\é, an identity
 * escape) loses that backslash. Strings, identifiers and templates are ASCII by then (see buildBundle).
 */
export function asciiOnly(text) {
  return text.replace(/(\\*)([^\x00-\x7f])/g, (_, slashes, c) => `${slashes.length % 2 ? slashes.slice(1) : slashes}\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

/**
 * Old builds go once nobody can still be starting from them: a build is marked retired when it
 * stops being current and deleted at a later build, KEEP_OLD_MS after that mark.
 */
function retireOldBuilds(current) {
  const now = Date.now();
  for (const d of readdirSync(cache)) {
    if (!/^build-\d+-/.test(d) || d === current) continue;
    const mark = join(cache, d, 'retired');
    try {
      const since = Number(readFileSync(mark, 'utf8'));
      if (now - since > KEEP_OLD_MS) rmSync(join(cache, d), { recursive: true, force: true });
    } catch {
      try { writeFileSync(mark, String(now)); } catch { /* it goes at a later build */ }
    }
  }
}

/**
 * Loads a CommonJS bundle with a V8 code cache beside it, one per `key` (the command), so a start
 * skips parsing and compiling the functions the same command ran before.
 * @returns the module's exports, and saveCodeCache() to call once the command has run: it writes
 *   the cache (now holding every function compiled so far) when there was none or V8 refused it
 * @example const { exports, saveCodeCache } = loadBundle(entry, 'render')
 */
export function loadBundle(entry, key) {
  const source = readFileSync(entry, 'utf8');
  const cacheFile = join(dirname(entry), `${basename(entry, '.cjs')}.${key}.v8cache`);
  let cachedData;
  try { cachedData = readFileSync(cacheFile); } catch { /* first run of this command */ }
  const script = new vm.Script(`(function (exports, require, module, __filename, __dirname, __vaultbookImport) {${source}\n})`, { filename: entry, cachedData });
  const module = { exports: {} };
  // The bundle's import() of vite and playwright-core (see buildBundle), resolved from here.
  const importer = (specifier) => import(specifier);
  script.runInThisContext()(module.exports, createRequire(entry), module, entry, dirname(entry), importer);
  return {
    exports: module.exports,
    saveCodeCache() {
      if (cachedData && !script.cachedDataRejected) return;
      try {
        const tmp = `${cacheFile}.${process.pid}`;
        writeFileSync(tmp, script.createCachedData());
        renameSync(tmp, cacheFile);
      } catch { /* a cache is an optimisation: a read-only install runs without one */ }
    },
  };
}

/** The bundle's entry, rebuilt first when any source is newer than it. */
export async function ensureBundle() {
  const current = currentBuild();
  if (current && current.builtAt >= newestSource()) return current.entry;
  return buildBundle();
}

// `node bin/bundle.js` (npm's prepare step) builds it ahead of the first run; never fails the install.
if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  buildBundle().then(
    (p) => console.log(`vaultbook: command bundle built at ${p}`),
    (e) => console.warn(`vaultbook: could not prebuild the command bundle (${e.message}); it will run through tsx`),
  );
}
