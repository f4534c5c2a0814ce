// The worker thread's entry: teach this thread TypeScript (tsx, the same
// runtime the migrations use, for both module kinds), then load the tasks.
import { register as registerCjs } from 'tsx/cjs/api';
import { register as registerEsm } from 'tsx/esm/api';

registerCjs();
registerEsm();
const loaded = await import('./heavy-worker.ts');
// Loaded as CommonJS (the project is not "type": "module"), its exports sit on `default`.
const tasks = loaded.thumbnail ? loaded : loaded.default;
export const { ready, thumbnail, findings, gagPassSvgs, reviewPdf, templatesPdf } = tasks;
