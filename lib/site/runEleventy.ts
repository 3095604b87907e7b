import { readdirSync } from "node:fs";
import { join, relative, resolve, sep } from "node:path";
import { fileURLToPath } from "node:url";
import Eleventy from "@11ty/eleventy";
import eleventyConfig from "../../eleventy.config.ts";
import type { SiteData, SpeciesPageView } from "./pageData.ts";

export const contentDir = fileURLToPath(new URL("../../content", import.meta.url));

/** The template that makes one page per atlas entry (paginated over `atlas.speciesPages`). */
type PageData = Omit<SiteData, "speciesPageViews"> & { speciesPages: SpeciesPageView[] };

const speciesTemplate = "species.njk";
/** The templates of a molecule's own pages; a batch run renders these, the site run all others. */
export const moleculeTemplates: readonly string[] = ["molecule.njk", speciesTemplate, "bench.njk"];

/**
 * Species pages rendered per Eleventy run. Eleventy keeps every page it rendered in memory until
 * its run ends (toJSON returns them all), and species pages are large (tables and two inline
 * SVGs), so a large batch is rendered in parts: the peak memory then stays near one part's.
 */
export const speciesPagesPerRun = 250;

/**
 * Renders content/ with templates/ into outDir, the atlas's data as the global `atlas`:
 * "molecules" renders the batch's molecule, species and bench pages (the species pages in parts
 * of speciesPagesPerRun), "site" every other page.
 */
export async function runEleventy(outDir: string, data: SiteData, pages: "molecules" | "site", options: RunOptions): Promise<number> {
  const perRun = Math.max(1, options.speciesPagesPerRun ?? speciesPagesPerRun);
  const write = options.write;
  const { speciesPageViews, ...rest } = data;
  const templates = readdirSync(contentDir).filter((f) => /\.(njk|md)$/.test(f));
  if (pages === "site") return runOnce(outDir, { ...rest, speciesPages: [] }, moleculeTemplates, write);
  const notMolecule = templates.filter((f) => !moleculeTemplates.includes(f));
  // The first run renders the molecule and bench pages with the first part of the species pages;
  // later runs render the species template alone with the next parts.
  let count = await runOnce(outDir, { ...rest, speciesPages: speciesPageViews.views(0, perRun) }, notMolecule, write);
  const speciesOnly = templates.filter((f) => f !== speciesTemplate);
  for (let start = perRun; start < speciesPageViews.count; start += perRun) {
    count += await runOnce(outDir, { ...rest, speciesPages: speciesPageViews.views(start, start + perRun) }, speciesOnly, write);
  }
  return count;
}

export interface RunOptions {
  speciesPagesPerRun?: number;
  /** Where each rendered page goes, by its path relative to outDir. */
  write: (path: string, content: string) => void;
}

async function runOnce(outDir: string, data: PageData, ignored: readonly string[], write: (path: string, content: string) => void): Promise<number> {
  const eleventy = new Eleventy(contentDir, outDir, {
    quietMode: true,
    // The one configuration arrives below as a function; a falsy path stops Eleventy from also
    // loading a configuration file it finds in the working directory (the compiled
    // eleventy.config.js beside eleventy.config.ts would otherwise register everything twice).
    configPath: false as unknown as string,
    config(config: any) {
      eleventyConfig(config);
      // Eleventy matches ignores as paths relative to the working directory (an absolute path never matches).
      for (const file of ignored) config.ignores.add(relative(process.cwd(), join(contentDir, file)));
      config.addGlobalData("atlas", data);
    },
  });
  // toJSON renders without writing (and without Eleventy's forced console summary); the pages
  // are handed on here, each checked to lie inside outDir.
  const pages = (await eleventy.toJSON()) as Array<{ url: string | false; outputPath: string | false; content: string }>;
  const root = resolve(outDir);
  for (const page of pages) {
    if (page.outputPath === false) continue;
    const target = resolve(page.outputPath);
    if (!target.startsWith(root + sep)) throw new Error(`Eleventy page ${String(page.url)} would be written outside the site: ${target}`);
    write(relative(root, target).split(sep).join("/"), page.content);
  }
  return pages.length;
}
