import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { chromium, type Browser, type BrowserContextOptions, type Page } from "playwright-core";
import { inject } from "vitest";
import { serveFolder } from "../../lib/build/staticServer.ts";

/** Debian's Chromium, headless, with the flags this machine needs; fails (never skips) when it is missing. */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: "/usr/bin/chromium",
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--no-first-run", "--disable-sync"],
  });
}

/** Collects script errors, Content-Security-Policy violations (console errors) and HTTP errors of a page. */
export function recordPageProblems(page: Page, problems: string[]): void {
  page.on("console", (m) => m.type() === "error" && problems.push(m.text()));
  page.on("pageerror", (e) => problems.push(e.message));
  page.on("response", (r) => r.status() >= 400 && problems.push(`${r.status()} ${r.url()}`));
}

/** The shipped atlas built (without sheets) into a temporary folder, served, and one Chromium page on it. */
export interface BuiltSiteSession {
  work: string;
  site: string;
  base: string;
  browser: Browser;
  page: Page;
  close(): Promise<void>;
}

export async function openBuiltSite(name: string, problems: string[], context: BrowserContextOptions = {}): Promise<BuiltSiteSession> {
  const work = mkdtempSync(join(tmpdir(), `bandatlas-${name}-`));
  // The shipped atlas the global setup built once (test/helpers/globalSetup.ts); read only.
  const site = inject("shippedSite").outDir;
  const server = await serveFolder(site);
  const browser = await launchChromium();
  const page = await (await browser.newContext(context)).newPage();
  recordPageProblems(page, problems);
  return {
    work,
    site,
    base: server.base,
    browser,
    page,
    async close() {
      await browser.close();
      await server.close();
      rmSync(work, { recursive: true, force: true });
    },
  };
}
