// Worker entry: a worker process started from the sources has no TypeScript loader, so register it
// here (resolved from this repository, whatever the current folder) before
// loading the TypeScript worker.
import { register } from 'tsx/esm/api';

register();
await import('./worker.ts');
