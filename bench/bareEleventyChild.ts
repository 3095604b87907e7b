// Child process of the baseline: a bare Eleventy build of `pages` pages of trivial content (one
// paginated Nunjucks template, one tiny layout), written to disk the same way the site is.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import Eleventy from "@11ty/eleventy";
import { reportToParent } from "./childProcess.ts";

const started = performance.now();
const { pages } = JSON.parse(process.argv[2]) as { pages: number };
const root = mkdtempSync(join(tmpdir(), "bandatlas-bare-eleventy-"));
try {
  const input = join(root, "content");
  mkdirSync(join(input, "_includes"), { recursive: true });
  writeFileSync(join(input, "_includes", "base.njk"), "<!doctype html><html lang=en><title>{{ title }}</title><body>{{ content | safe }}</body></html>\n");
  writeFileSync(
    join(input, "page.njk"),
    `---\npagination:\n  data: items\n  size: 1\n  alias: item\npermalink: "page-{{ item }}/index.html"\nlayout: base.njk\ntitle: trivial page\n---\n<p>Trivial page {{ item }}.</p>\n`,
  );
  const eleventy = new Eleventy(input, join(root, "site"), {
    quietMode: true,
    // A bare baseline: not the project's compiled eleventy.config.js in the working directory.
    configPath: false as unknown as string,
    config(config: any) {
      config.addGlobalData(
        "items",
        Array.from({ length: pages }, (_, i) => i),
      );
    },
  });
  await eleventy.write();
  reportToParent({ pages, inProcessMs: performance.now() - started });
} finally {
  rmSync(root, { recursive: true, force: true });
}
