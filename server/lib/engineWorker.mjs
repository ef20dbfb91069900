// Worker-thread bootstrap: loads the TypeScript worker through tsx (worker threads do not inherit the loader).
import { tsImport } from 'tsx/esm/api';

const mod = await tsImport('./engineWorker.ts', import.meta.url);
export const rank = mod.rank;
export const calibrate = mod.calibrate;
