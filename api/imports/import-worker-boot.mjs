// Worker threads do not inherit tsx's loader hooks: register them, then load the TypeScript worker.
import { register } from 'tsx/esm/api';

register();
await import('./import-worker.ts');
