#!/usr/bin/env node
// Launcher. Runs the command line from an esbuild bundle (rebuilt when a source is newer) with a
// V8 code cache per command, which starts several times faster than loading the TypeScript
// sources through tsx; falls back to tsx if the bundle cannot be built or loaded.
// VAULTBOOK_NO_BUNDLE=1 forces the tsx path.
import { setFlagsFromString } from 'node:v8';

// A command mostly runs for under a second, most of its code only once. With V8's defaults the
// optimising compiler spends more CPU (on the second core, and in stalls on this one) than it
// saves in that time, so it is asked to wait for 16 times the usual work before optimising a
// function; a hot loop is still optimised within milliseconds. Set before any of our code loads.
// (Repeated cold renders of the largest template: CPU 1.5 → 1.07 s, wall 1.02 → 0.89 s.)
setFlagsFromString('--interrupt-budget=1081344');

// A reader that stops early (`vaultbook eval calc.md | head -2`) closes the pipe: the rest of the
// output is dropped quietly and the command ends with its own exit code, without a stack trace.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (e) => {
    if (e.code !== 'EPIPE') throw e;
    stream.write = (_chunk, encoding, callback) => {
      const done = typeof encoding === 'function' ? encoding : callback;
      if (typeof done === 'function') queueMicrotask(done);
      return true;
    };
  });
}

const argv = process.argv.slice(2);
let main;
let saveCodeCache = () => {};
if (!process.env.VAULTBOOK_NO_BUNDLE) {
  try {
    const { ensureBundle, loadBundle } = await import('./bundle.js');
    const command = ['eval', 'check', 'new', 'diff', 'render', 'serve'].includes(argv[0]) ? argv[0] : 'other';
    const loaded = loadBundle(await ensureBundle(), command);
    ({ main } = loaded.exports);
    saveCodeCache = loaded.saveCodeCache;
  } catch (e) {
    process.stderr.write(`vaultbook: running without the command bundle (${e.message})\n`);
  }
}
if (!main) {
  const { register } = await import('tsx/esm/api');
  register();
  ({ main } = await import('./cli.ts'));
}
// The cache is written once: when a command that keeps running (serve) says it has started, or at the end.
let saved = false;
const saveOnce = () => { if (!saved) { saved = true; saveCodeCache(); } };
process.once('vaultbook:started', saveOnce);
process.exitCode = await main(argv);
saveOnce();
