/**
 * `npm run docs`: writes docs/kernel.md from the cell functions' registrations.
 * `npm run docs -- --check` only compares, and exits 1 when the file is stale.
 */
import { readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { cellFunctions } from '../engine/library.js';
import { referenceDocument } from './reference.js';

/** Where the kernel reference is committed. */
export const KERNEL_DOC = fileURLToPath(new URL('../docs/kernel.md', import.meta.url));

/** The text docs/kernel.md must hold. */
export function kernelDocument(): string {
  return referenceDocument([...cellFunctions.values()]);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const text = kernelDocument();
  if (process.argv.includes('--check')) {
    let old = '';
    try { old = readFileSync(KERNEL_DOC, 'utf8'); } catch { /* missing counts as stale */ }
    if (old !== text) {
      process.stderr.write('docs/kernel.md is stale: run npm run docs\n');
      process.exit(1);
    }
  } else {
    mkdirSync(new URL('../docs/', import.meta.url), { recursive: true });
    writeFileSync(KERNEL_DOC, text);
    process.stdout.write(`wrote docs/kernel.md (${cellFunctions.size} functions)\n`);
  }
}
