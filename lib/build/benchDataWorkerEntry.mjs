// Worker threads start without the TypeScript loader the main thread has; register tsx first,
// as bin/bandatlas.js does, then load the worker's TypeScript.
import { register } from "tsx/esm/api";

register();
await import("./benchDataWorker.ts");
