// Loads the TypeScript worker through tsx in any host (npm start, vitest, the benchmark).
import { register } from 'tsx/esm/api';

register();
await import('./engine-worker.ts');
