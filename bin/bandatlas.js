#!/usr/bin/env node
// Entry point of the `bandatlas` command: lib/'s compiled JavaScript when it is fresh (see
// compiled.js), else the TypeScript sources through tsx's loader.
import { spawn } from "node:child_process";
import { cappedCommands, heapCapArgs } from "./heapCap.js";

const cap = cappedCommands.includes(process.argv[2]) ? heapCapArgs(process.execArgv, process.env.NODE_OPTIONS) : [];
if (cap.length) {
  // A V8 heap size is fixed when Node starts, so the build runs in a second Node with the cap.
  // Signals sent to this process are passed on (Ctrl-C in a terminal reaches both already; the
  // commands take a repeated one as one), and this one exits as the build does.
  const child = spawn(process.execPath, [...process.execArgv, ...cap, ...process.argv.slice(1)], { stdio: "inherit" });
  for (const signal of ["SIGINT", "SIGTERM"]) process.on(signal, () => child.kill(signal));
  child.on("exit", (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
} else {
  const { compiledIsFresh } = await import("./compiled.js");
  if (compiledIsFresh()) {
    // Worker threads inherit this, and load the compiled worker modules too.
    process.env.BANDATLAS_COMPILED = "1";
    await import("../lib/cli/run.js");
  } else {
    const { register } = await import("tsx/esm/api");
    register();
    await import("../lib/cli/run.ts");
  }
}
