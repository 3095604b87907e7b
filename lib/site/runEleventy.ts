import { fileURLToPath } from "node:url";
import Eleventy from "@11ty/eleventy";
import eleventyConfig from "../../eleventy.config.ts";
import type { SiteData } from "./pageData.ts";

export const contentDir = fileURLToPath(new URL("../../content", import.meta.url));

/** Renders content/ with templates/ into outDir, the atlas's data as the global `atlas`. */
export async function runEleventy(outDir: string, data: SiteData): Promise<void> {
  const eleventy = new Eleventy(contentDir, outDir, {
    quietMode: true,
    config(config: any) {
      eleventyConfig(config);
      config.addGlobalData("atlas", data);
    },
  });
  await eleventy.write();
}
