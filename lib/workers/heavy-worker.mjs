// The worker thread's entry: teach this thread TypeScript (tsx, the same
// runtime the migrations use, for both module kinds), then load the tasks.
import { setPriority } from 'node:os';
import { register as registerCjs } from 'tsx/cjs/api';
import { register as registerEsm } from 'tsx/esm/api';

// This thread yields the CPU to the request thread: on Linux a nice value belongs to each thread, so
// this lowers the large jobs only, and requests keep their answers quick on a small machine (elsewhere, or
// where lowering is not allowed, it runs at the usual priority).
try {
  setPriority(15);
} catch {
  /* the usual priority */
}

registerCjs();
registerEsm();
const loaded = await import('./heavy-worker.ts');
// Loaded as CommonJS (the project is not "type": "module"), its exports sit on `default`.
const tasks = loaded.thumbnail ? loaded : loaded.default;
export const { ready, thumbnail, findings, gagPassSvgs, reviewPdf, templatesPdf, analyseFinalPage, printFile } = tasks;
