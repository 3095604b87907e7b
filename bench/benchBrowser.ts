import { createReadStream, existsSync, statSync } from "node:fs";
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { extname, join, normalize } from "node:path";
import { chromium, type Browser } from "playwright-core";

const types: Record<string, string> = {
  ".html": "text/html",
  ".js": "text/javascript",
  ".json": "application/json",
  ".css": "text/css",
  ".svg": "image/svg+xml",
  ".bin": "application/octet-stream",
};

/** Serves a built site folder on a free local port (the browser benches' own small server). */
export async function serveSite(siteDir: string): Promise<{ server: Server; base: string }> {
  const server = createServer((req, res) => {
    const path = join(siteDir, normalize(decodeURIComponent(new URL(req.url!, "http://x").pathname)).replace(/^[/\\]+/, "") || "index.html");
    const file = existsSync(path) && statSync(path).isDirectory() ? join(path, "index.html") : path;
    if (!file.startsWith(siteDir) || !existsSync(file)) return res.writeHead(404).end();
    res.writeHead(200, { "content-type": types[extname(file)] ?? "application/octet-stream" });
    createReadStream(file).pipe(res);
  });
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  return { server, base: `http://127.0.0.1:${(server.address() as AddressInfo).port}/` };
}

/** Debian's Chromium, headless, with the flags this machine needs (no GPU, no network). */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: "/usr/bin/chromium",
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--no-first-run", "--disable-sync"],
  });
}
