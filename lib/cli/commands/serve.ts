import { watch, type FSWatcher } from "node:fs";
import { join } from "node:path";
import EleventyDevServer from "@11ty/eleventy-dev-server";
import { BuildCache, buildSite, keptPagesKind, repoDir } from "../../build/index.ts";
import { formatProblem, MoleculeFileError } from "../../molecules/index.ts";
import { moleculesDir } from "../moleculeSource.ts";
import { numberOption, parseCommandLine } from "../options.ts";
import { UsageError } from "../usageError.ts";

export const serveHelp = `bandatlas serve [options]

Builds the atlas into site/ and serves it on http://localhost with live reload. Editing a
molecule file (or a template or page) rebuilds the site; a failed rebuild prints what is wrong
and keeps serving the last good site. Stop with Ctrl-C.

  --port <n>              port to listen on (default 8080; the next free one if taken)
  --molecules <dir>       read molecule files from <dir> instead of the shipped ones
  --out <dir>             build and serve <dir> instead of site/`;

function describeFailure(error: unknown): string {
  if (error instanceof MoleculeFileError) return error.problems.map(formatProblem).join("\n");
  return error instanceof Error ? error.message : String(error);
}

/**
 * How long a watched file must stay quiet before the rebuild starts: editors save in a few
 * events (truncate, write, rename) within milliseconds, and one rebuild should follow them all.
 */
const saveSettleMs = 100;

export async function runServe(args: string[]): Promise<string> {
  const { values } = parseCommandLine("serve", args, { port: { type: "string" }, molecules: { type: "string" }, out: { type: "string" } }, 0);
  if (values.help) return serveHelp + "\n";
  const port = numberOption("port", values.port as string | undefined, 8080);
  if (!Number.isInteger(port) || port < 1 || port > 65535) throw new UsageError(`--port ${values.port}: a port is a whole number from 1 to 65535`);
  const molecules = moleculesDir(values.molecules as string | undefined);
  const siteDir = (values.out as string | undefined) ?? join(repoDir, "site");
  const say = (line: string) => process.stdout.write(`${line}\n`);

  // Entries and plots of molecule files that did not change are reused from the previous build.
  const cache = new BuildCache();
  const rebuild = async (): Promise<boolean> => {
    const started = performance.now();
    try {
      // Sheets are left out while serving so a save shows up in seconds; `bandatlas build` makes them.
      await buildSite({ moleculesDir: molecules, outDir: siteDir, sheets: false, cache });
      say(`built site/ in ${((performance.now() - started) / 1000).toFixed(1)} s`);
      return true;
    } catch (error) {
      say(`build failed, still serving the previous site:\n${describeFailure(error)}`);
      return false;
    }
  };

  if (!(await rebuild())) throw new UsageError("the first build failed; fix the problems above and run bandatlas serve again");
  const server = EleventyDevServer.getServer("bandatlas", siteDir, { port, liveReload: true, domDiff: false, showVersion: false });
  server.serve(port);

  let timer: NodeJS.Timeout | undefined;
  let templatesChanged = false;
  let running: Promise<void> = Promise.resolve();
  const schedule = (what: string) => {
    clearTimeout(timer);
    timer = setTimeout(() => {
      running = running.then(async () => {
        say(`${what} changed, rebuilding …`);
        // Kept molecule pages were rendered with the old templates. Consumed here, when the
        // rebuild starts, so a template saved during a running build still counts for the next.
        if (templatesChanged) cache.forget(keptPagesKind);
        templatesChanged = false;
        if (await rebuild()) server.reload({ files: [], build: {} });
      });
    }, saveSettleMs);
  };
  const watchers: FSWatcher[] = [
    watch(molecules, (_event, name) => name && /\.ya?ml$/.test(name) && schedule(name)),
    ...["content", "templates"].map((dir) =>
      watch(join(repoDir, dir), { recursive: true }, (_event, name) => {
        if (!name) return;
        templatesChanged = true;
        schedule(`${dir}/${name}`);
      }),
    ),
  ];

  // A Ctrl-C may arrive twice (from the terminal and passed on by bin/bandatlas.js): both stop.
  await new Promise<void>((resolve) => process.on("SIGINT", () => resolve()));
  for (const w of watchers) w.close();
  clearTimeout(timer);
  await server.close();
  return "stopped\n";
}
