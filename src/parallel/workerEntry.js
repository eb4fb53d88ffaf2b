// Entry of the pool's worker threads: registers tsx's loader in the thread, then loads the
// TypeScript worker, so workers run the same source as the main thread without a compile step.
import { register } from 'tsx/esm/api';

register();
await import('./worker.ts');
