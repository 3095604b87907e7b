// The one Eleventy configuration of the site: template directories, Nunjucks settings, plugins
// and filters. lib/site runs Eleventy programmatically and passes this function in; the atlas's
// data arrives as global data from the build, never from Eleventy data files.
import syntaxHighlight from "@11ty/eleventy-plugin-syntaxhighlight";
import { EleventyRenderPlugin } from "@11ty/eleventy";
import { relativeUrl } from "./lib/shared/sitePaths.ts";
import { constantSymbol } from "./lib/site/constantSymbols.ts";

interface EleventyPageContext {
  page: { url: string };
}

/** The page's own path relative to the site root ("molecules/co/index.html"). */
function pagePath(url: string): string {
  const path = url.replace(/^\//, "");
  return path === "" || path.endsWith("/") ? `${path}index.html` : path;
}

export default function eleventyConfig(config: any): void {
  config.setIncludesDirectory("../templates");
  config.setLayoutsDirectory("../templates/layouts");
  config.setTemplateFormats(["njk", "md"]);
  // Molecule files are untrusted: autoescape everything; throw on a misspelt variable so a
  // template bug fails the build instead of printing an empty cell.
  config.setNunjucksEnvironmentOptions({ autoescape: true, throwOnUndefined: true, trimBlocks: true, lstripBlocks: true });
  config.addPlugin(syntaxHighlight);
  config.addPlugin(EleventyRenderPlugin);
  config.setQuietMode(true);

  /** A link from the current page to a site path, relative so the site also works from disk. */
  config.addFilter("href", function (this: EleventyPageContext, target: string) {
    return relativeUrl(pagePath(this.page.url), target);
  });
  config.addFilter("constantSymbol", constantSymbol);
  /** The way from the current page back to the site root ("", "../", "../../../"). */
  config.addFilter("rootPrefix", function (this: EleventyPageContext) {
    return relativeUrl(pagePath(this.page.url), "x").slice(0, -1);
  });
}
