import { parentPort } from "node:worker_threads";
import type { Molecule } from "../molecules/index.ts";
import { moleculeBenchData } from "./benchData.ts";

// Claims molecule numbers from the counter it shares with the main thread and posts each
// molecule's bench data back (plain data), until none are left.
parentPort!.once("message", (message: { molecules: Molecule[]; claim: SharedArrayBuffer }) => {
  const next = new Int32Array(message.claim);
  for (let i = Atomics.add(next, 0, 1); i < message.molecules.length; i = Atomics.add(next, 0, 1)) {
    try {
      parentPort!.postMessage({ index: i, data: moleculeBenchData(message.molecules[i]) });
    } catch (error) {
      parentPort!.postMessage({ index: i, error: error instanceof Error ? error.message : String(error) });
      return;
    }
  }
  parentPort!.postMessage({ finished: true });
});
