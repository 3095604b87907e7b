import { chromium, type Browser } from "playwright-core";

/** Debian's Chromium, headless, with the flags this machine needs (no GPU, no network). */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: "/usr/bin/chromium",
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--no-first-run", "--disable-sync"],
  });
}
