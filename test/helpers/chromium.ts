import { chromium, type Browser, type Page } from "playwright-core";

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
