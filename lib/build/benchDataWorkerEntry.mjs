// Worker threads start without the main thread's module loader. When the command runs lib/'s
// compiled JavaScript (bin/bandatlas.js sets BANDATLAS_COMPILED, which workers inherit) the worker
// loads the compiled module; otherwise (tests, a source newer than its compiled output) it
// registers tsx first and loads the TypeScript. No top-level await: the pool reads this module's
// default export without waiting for one.
const worker =
  process.env.BANDATLAS_COMPILED === "1"
    ? import("./benchDataWorker.js")
    : import("tsx/esm/api").then(({ register }) => {
        register();
        return import("./benchDataWorker.ts");
      });

export default async function runBenchDataJob(molecule) {
  return (await worker).default(molecule);
}
