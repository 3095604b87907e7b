import { mkdirSync, writeFileSync } from "node:fs";
import { dirname, resolve, sep } from "node:path";
import { fileURLToPath } from "node:url";
import Eleventy from "@11ty/eleventy";
import eleventyConfig from "../../eleventy.config.ts";
import type { SiteData } from "./pageData.ts";

export const contentDir = fileURLToPath(new URL("../../content", import.meta.url));

/** Renders content/ with templates/ into outDir, the atlas's data as the global `atlas`. */
export async function runEleventy(outDir: string, data: SiteData): Promise<number> {
  const eleventy = new Eleventy(contentDir, outDir, {
    quietMode: true,
    config(config: any) {
      eleventyConfig(config);
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
