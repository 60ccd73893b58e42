// Worker entry: worker threads do not inherit the tsx loader, so register it
// here (resolved from this repository, whatever the current folder) before
// loading the TypeScript worker.
import { register } from 'tsx/esm/api';

register();
await import('./worker.ts');
