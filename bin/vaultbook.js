#!/usr/bin/env node
// Launcher. Runs the command line from an esbuild bundle (rebuilt when a source is newer), which
// starts several times faster than loading the TypeScript sources through tsx; falls back to tsx
// if the bundle cannot be built. VAULTBOOK_NO_BUNDLE=1 forces the tsx path.
let main;
if (!process.env.VAULTBOOK_NO_BUNDLE) {
  try {
    const { ensureBundle } = await import('./bundle.js');
    ({ main } = await import(await ensureBundle()));
  } catch (e) {
    process.stderr.write(`vaultbook: running without the command bundle (${e.message})\n`);
  }
}
if (!main) {
  const { register } = await import('tsx/esm/api');
  register();
  ({ main } = await import('./cli.ts'));
}
process.exitCode = await main(process.argv.slice(2));
