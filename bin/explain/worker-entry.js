// Worker entry from the sources: worker threads do not inherit the tsx loader, so register it
// here before loading the TypeScript worker (the command bundle builds the worker as its own file).
import { register } from 'tsx/esm/api';

register();
await import('./worker.ts');
