// Worker threads start without the TypeScript loader the main thread has; register tsx first,
// as bin/bandatlas.js does, then load the worker's TypeScript. No top-level await: the pool reads
// this module's default export without waiting for one.
import { register } from "tsx/esm/api";

register();
const worker = import("./benchDataWorker.ts");

export default async function runBenchDataJob(molecule) {
  return (await worker).default(molecule);
}
