import { mkdirSync, readdirSync, writeFileSync } from "node:fs";
import { dirname, join, resolve, sep } from "node:path";
import { fileURLToPath } from "node:url";
import Eleventy from "@11ty/eleventy";
import eleventyConfig from "../../eleventy.config.ts";
import type { SiteData, SpeciesPageView } from "./pageData.ts";

export const contentDir = fileURLToPath(new URL("../../content", import.meta.url));

/** The template that makes one page per atlas entry (paginated over `atlas.speciesPages`). */
type PageData = Omit<SiteData, "speciesPageViews"> & { speciesPages: SpeciesPageView[] };

const speciesTemplate = "species.njk";

/**
 * Species pages rendered per Eleventy run. Eleventy keeps every page it rendered in memory until
 * its run ends (toJSON returns them all), and species pages are large (tables and two inline
 * SVGs), so a large atlas is rendered in batches: the peak memory then stays near one batch's.
 */
export const speciesPagesPerRun = 250;

/** Renders content/ with templates/ into outDir, the atlas's data as the global `atlas`. */
export async function runEleventy(outDir: string, data: SiteData, options: { speciesPagesPerRun?: number } = {}): Promise<number> {
  const perRun = Math.max(1, options.speciesPagesPerRun ?? speciesPagesPerRun);
  const { speciesPageViews, ...rest } = data;
  // The first run renders every page, with the first batch of species pages; later runs render
  // the species template alone with the next batches.
  const others = readdirSync(contentDir).filter((f) => /\.(njk|md)$/.test(f) && f !== speciesTemplate);
  let pages = await runOnce(outDir, { ...rest, speciesPages: speciesPageViews.views(0, perRun) }, []);
  for (let start = perRun; start < speciesPageViews.count; start += perRun) pages += await runOnce(outDir, { ...rest, speciesPages: speciesPageViews.views(start, start + perRun) }, others);
  return pages;
}

async function runOnce(outDir: string, data: PageData, ignored: string[]): Promise<number> {
  const eleventy = new Eleventy(contentDir, outDir, {
    quietMode: true,
    config(config: any) {
      eleventyConfig(config);
      for (const file of ignored) config.ignores.add(join(contentDir, file));
      config.addGlobalData("atlas", data);
    },
  });
  // toJSON renders without writing (and without Eleventy's forced console summary); the pages
  // are written here, each inside outDir.
  const pages = (await eleventy.toJSON()) as Array<{ url: string | false; outputPath: string | false; content: string }>;
  const root = resolve(outDir);
  for (const page of pages) {
    if (page.outputPath === false) continue;
    const target = resolve(page.outputPath);
    if (!target.startsWith(root + sep)) throw new Error(`Eleventy page ${String(page.url)} would be written outside the site: ${target}`);
    mkdirSync(dirname(target), { recursive: true });
    writeFileSync(target, page.content);
  }
  return pages.length;
}
