import { createReadStream, existsSync, statSync } from "node:fs";
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { extname, join, normalize, sep } from "node:path";

const types: Record<string, string> = {
  ".html": "text/html; charset=utf-8",
  ".css": "text/css",
  ".js": "text/javascript",
  ".json": "application/json",
  ".svg": "image/svg+xml",
  ".csv": "text/csv; charset=utf-8",
  ".pdf": "application/pdf",
  ".bin": "application/octet-stream",
};

/** Serves a built site folder on 127.0.0.1 (a random port): the browser tests and benches use it. */
export async function serveFolder(site: string): Promise<{ base: string; close: () => Promise<void> }> {
  const server: Server = createServer((req, res) => {
    const path = normalize(decodeURIComponent(new URL(req.url!, "http://x").pathname)).replace(/^[/\\]+/, "");
    let file = join(site, path);
    if (!file.startsWith(site + sep) && file !== site) return void res.writeHead(403).end();
    if (existsSync(file) && statSync(file).isDirectory()) file = join(file, "index.html");
    if (!existsSync(file)) return void res.writeHead(404).end("not found");
    res.writeHead(200, { "content-type": types[extname(file)] ?? "application/octet-stream" });
    createReadStream(file).pipe(res);
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  return { base: `http://127.0.0.1:${(server.address() as AddressInfo).port}/`, close: () => new Promise((resolve) => server.close(() => resolve())) };
}
