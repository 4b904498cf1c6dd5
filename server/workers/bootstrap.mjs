// Worker threads do not get the parent's `--import tsx` loader on Node.js 20: register tsx here,
// then load the TypeScript entry named in workerData.
import { workerData } from "node:worker_threads";
import { register } from "tsx/esm/api";

register();
await import(workerData.entry);
