/**
 * Runs every benchmark module test/bench/*.bench.ts and prints its lines.
 * Each module exports `async function run(): Promise<string[]>`.
 */
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
for (const file of readdirSync(here).filter((f) => f.endsWith('.bench.ts')).sort()) {
  const mod = (await import(pathToFileURL(join(here, file)).href)) as { run?: () => Promise<string[]> };
  if (typeof mod.run !== 'function') {
    console.log(`${file}: no run() export, skipped`);
    continue;
  }
  for (const line of await mod.run()) console.log(line);
}
