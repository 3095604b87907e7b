import { spawn } from "node:child_process";
import { fileURLToPath } from "node:url";
import { heapCapArgs } from "../bin/heapCap.js";

export const repoDir = fileURLToPath(new URL("..", import.meta.url));

export interface ChildResult<T> {
  /** What the child printed as its last line, parsed as JSON. */
  value: T;
  /** From spawn to exit, including Node's start and module loading. */
  wallMs: number;
  /** Peak resident memory of the child (all its threads), from process.resourceUsage() in the child. */
  maxRssMb: number;
}

/**
 * Runs a bench script (TypeScript, through tsx) in a fresh Node process, so every build is cold
 * and its peak memory is its own. The script prints one JSON line last: { ...value, maxRssKb }.
 */
export function runChild<T>(script: string, args: unknown, extraNodeArgs: string[] = []): Promise<ChildResult<T>> {
  return new Promise((resolve, reject) => {
    const started = performance.now();
    const child = spawn(process.execPath, [...extraNodeArgs, "--import", "tsx", fileURLToPath(new URL(script, import.meta.url)), JSON.stringify(args)], {
      cwd: repoDir,
      stdio: ["ignore", "pipe", "pipe"],
    });
    let out = "";
    let err = "";
    child.stdout.on("data", (d) => (out += d));
    child.stderr.on("data", (d) => (err += d));
    child.on("error", reject);
    child.on("exit", (code) => {
      const wallMs = performance.now() - started;
      if (code !== 0) return reject(new Error(`${script} exited with ${code}:\n${err.slice(-2000)}`));
      const last = out.trim().split("\n").pop()!;
      const parsed = JSON.parse(last) as T & { maxRssKb: number };
      resolve({ value: parsed, wallMs, maxRssMb: parsed.maxRssKb / 1024 });
    });
  });
}

/** The last line a child prints: its result plus its own peak memory. */
export function reportToParent(value: object): void {
  process.stdout.write(`\n${JSON.stringify({ ...value, maxRssKb: process.resourceUsage().maxRSS })}\n`);
}

export const seconds = (ms: number) => `${(ms / 1000).toFixed(2)} s`;
export const mb = (value: number) => `${value.toFixed(0)} MB`;

/** The machine's load while measuring: the figures mean little without it. */
export async function loadNote(): Promise<string> {
  const { loadavg, cpus } = await import("node:os");
  const [one, five] = loadavg();
  return `load average ${one.toFixed(2)} (1 min), ${five.toFixed(2)} (5 min) on ${cpus().length} cores`;
}

/** A cold build in a fresh Node with the heap cap `bandatlas build` runs under (bin/heapCap.js). */
export function runBuildChild<T>(args: { moleculesDir: string; outDir: string; sheets: boolean }): Promise<ChildResult<T>> {
  return runChild<T>("./buildChild.ts", args, heapCapArgs(process.execArgv, process.env.NODE_OPTIONS));
}
