#!/usr/bin/env node
// Launcher: runs the TypeScript CLI through tsx, so `npx vaultbook` works right after `npm install`.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('./cli.ts');
process.exitCode = await main(process.argv.slice(2));
