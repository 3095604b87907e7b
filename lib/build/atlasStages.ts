// The stages about the whole atlas, after the last batch: the search indexes, the browser
// bundles and assets, the whole-atlas pages, the link check and the swap into place.
import { cpSync } from "node:fs";
import { join } from "node:path";
import { siteData } from "../site/pageData.ts";
import { contentDir, runEleventy } from "../site/runEleventy.ts";
import { nameIndexJson } from "../site/searchIndexes.ts";
import { lineIndexBytesPerLine } from "../shared/lineIndexCodec.ts";
import type { BuildContext } from "./buildContext.ts";
import { browserScripts, bundleBrowserScript } from "./bundleBrowser.ts";
import { checkInternalLinks } from "./checkLinks.ts";
import { swapDirectory } from "./swapDirectory.ts";

/** A build that cannot finish for a reason the person running it can fix (not a bug). */
export class BuildError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "BuildError";
  }
}

/** Base64 of `bytes` in pieces that join to the base64 of the whole (each a multiple of 3 bytes). */
function* base64Pieces(bytes: Uint8Array): Generator<string> {
  const piece = 3 << 16;
  for (let at = 0; at < bytes.length; at += piece)
    yield Buffer.from(bytes.buffer, bytes.byteOffset + at, Math.min(piece, bytes.length - at)).toString("base64");
}

export type LineIndexReport = Array<{ temperatureK: number; lines: number; bytes: number }>;

/** Search indexes: the molecule names and, per standard temperature, every line of the atlas. */
export function searchIndexStage(ctx: BuildContext): LineIndexReport {
  ctx.site.write(ctx.nameIndexPath, nameIndexJson(ctx.molecules));
  const report: LineIndexReport = [];
  for (const { temperatureK, path } of ctx.lineIndexPaths) {
    // Written a piece at a time: the same bytes as JSON.stringify(builder.finish()) without
    // holding the base64 text, its JSON copy and their UTF-8 copy at once (about 50 MB each
    // at one temperature of 2000 molecules).
    const { head, packed } = ctx.lineIndexes.get(temperatureK)!.finishPacked();
    ctx.lineIndexes.delete(temperatureK);
    const [before, after] = JSON.stringify({ ...head, data: "" }).split(/(?<="data":")(?="\}$)/);
    const bytes = ctx.site.writeParts(path, [before, ...base64Pieces(packed), after]);
    report.push({ temperatureK, lines: head.count, bytes });
  }
  return report;
}

/** The note the build prints about its search index. */
export function searchIndexLog(report: LineIndexReport): string {
  return `search index: ${report.map((r) => `${r.lines} lines at ${r.temperatureK} K`).join(", ")} (${lineIndexBytesPerLine} bytes a line before base64)`;
}

/** The browser bundles (kept for the session while serving) and the static assets. */
export async function scriptsAndAssetsStage(ctx: BuildContext): Promise<void> {
  const { cache } = ctx;
  for (const script of browserScripts) {
    const bytes = await (cache ? cache.forSession(`bundle ${script.path}`, () => bundleBrowserScript(script.entry)) : bundleBrowserScript(script.entry));
    ctx.site.write(script.path, bytes);
  }
  for (const asset of ["site.css", "favicon.svg"]) cpSync(join(contentDir, "assets", asset), join(ctx.work, "assets", asset));
}

/** The pages about the whole atlas (home, method, accuracy, search, bench and calibrate pages, …). */
export async function atlasPagesStage(ctx: BuildContext): Promise<void> {
  ctx.counts.pages += await runEleventy(ctx.work, siteData(ctx.siteInput(), null), "site", { write: (path, text) => ctx.site.write(path, text) });
}

/** Every internal link and anchor of the new site must resolve, or the previous site stays. */
export function linkCheckStage(ctx: BuildContext): ReturnType<typeof checkInternalLinks> {
  const links = checkInternalLinks(ctx.work);
  if (links.broken.length) {
    const sample = links.broken
      .slice(0, 10)
      .map((b) => `  ${b.page}: ${b.href} (${b.reason})`)
      .join("\n");
    throw new BuildError(`${links.broken.length} broken internal link${links.broken.length === 1 ? "" : "s"}; the previous site is left in place:\n${sample}`);
  }
  return links;
}

/** The finished site replaces the previous one in one step. */
export function swapStage(ctx: BuildContext): void {
  swapDirectory(ctx.work, ctx.outDir);
  ctx.cache?.endBuild();
}
