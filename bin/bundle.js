// Builds the command line into one bundle with esbuild, so that a cold `vaultbook` start loads a
// few files instead of thousands of modules through a TypeScript loader. Bundles live in
// node_modules/.cache/vaultbook/<build>/ (never committed); the file `current` names the newest.
// A build is never changed once written, so processes running side by side cannot break each
// other; a new one is made whenever a source file is newer than the current build.
import { readdirSync, statSync, existsSync, mkdirSync, writeFileSync, renameSync, rmSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const cache = join(root, 'node_modules', '.cache', 'vaultbook');
const pointer = join(cache, 'current');
const SOURCES = ['engine', 'cells', 'bin'];
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

/** The current build: {entry, builtAt} or null. */
function currentBuild() {
  try {
    const { dir, builtAt } = JSON.parse(readFileSync(pointer, 'utf8'));
    const entry = join(cache, dir, 'cli.mjs');
    return existsSync(entry) ? { entry, builtAt } : null;
  } catch {
    return null;
  }
}

/** Builds a new bundle, points `current` at it, and returns its entry path. */
export async function buildBundle() {
  const builtAt = Date.now();
  const dir = `build-${builtAt}-${process.pid}`;
  mkdirSync(cache, { recursive: true });
  // esbuild is loaded only when a build is needed, not on every start.
  const { build } = await import('esbuild');
  await build({
    entryPoints: { cli: join(root, 'bin', 'cli.ts') },
    bundle: true, splitting: true, format: 'esm', platform: 'node', target: 'node20',
    outdir: join(cache, dir), outExtension: { '.js': '.mjs' }, logLevel: 'error', legalComments: 'none',
    // Smaller text parses faster at every start; names are kept for messages and stack traces.
    minifyWhitespace: true, minifySyntax: true,
    // Packages that load their own files or binaries at run time stay in node_modules.
    external: ['vite', 'playwright-core', 'esbuild', 'tsx', 'fsevents', 'lightningcss'],
    plugins: existsSync(join(MATHJS_CORE, 'core', 'create.js')) ? [mathjsCore] : [],
    banner: { js: "import { createRequire as __vbRequire } from 'node:module'; const require = __vbRequire(import.meta.url);" },
  });
  const tmp = `${pointer}.${process.pid}`;
  writeFileSync(tmp, JSON.stringify({ dir, builtAt }));
  renameSync(tmp, pointer);
  // Old builds go once nobody can still be starting from them.
  for (const d of readdirSync(cache)) {
    const m = /^build-(\d+)-/.exec(d);
    if (m && d !== dir && builtAt - Number(m[1]) > KEEP_OLD_MS) rmSync(join(cache, d), { recursive: true, force: true });
  }
  return join(cache, dir, 'cli.mjs');
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
