import { closeSync, existsSync, fstatSync, openSync, readdirSync, readSync, statSync } from "node:fs";
import { dirname, join, relative, resolve } from "node:path";

export interface BrokenLink {
  page: string;
  href: string;
  reason: string;
}

function htmlFiles(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir).sort()) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) out.push(...htmlFiles(path));
    else if (name.endsWith(".html")) out.push(path);
  }
  return out;
}

const maxCachedPages = 64;

/** One page's bytes, read into a buffer reused from page to page: a site of any size makes no garbage per page but its attribute values. */
let pageBuffer = Buffer.alloc(1 << 20);
function readPage(file: string): Buffer {
  const fd = openSync(file, "r");
  try {
    const size = fstatSync(fd).size;
    if (size > pageBuffer.length) pageBuffer = Buffer.alloc(Math.max(size, 2 * pageBuffer.length));
    let read = 0;
    while (read < size) read += readSync(fd, pageBuffer, read, size - read, read);
    return pageBuffer.subarray(0, size);
  } finally {
    closeSync(fd);
  }
}

const whitespace = new Set([0x20, 0x09, 0x0a, 0x0d, 0x0c]);

/** The values of every `name="…"` attribute preceded by whitespace, as the regex /\sname="([^"]*)"/g would find them. */
function attributeValues(page: Buffer, name: string): string[] {
  const marker = Buffer.from(`${name}="`);
  const out: string[] = [];
  for (let at = page.indexOf(marker, 1); at >= 0; at = page.indexOf(marker, at + 1)) {
    if (!whitespace.has(page[at - 1])) continue;
    const start = at + marker.length;
    const end = page.indexOf(0x22, start);
    if (end < 0) break;
    out.push(page.toString("utf8", start, end));
  }
  return out;
}

const decodeEntities = (s: string) =>
  s
    .replace(/&amp;/g, "&")
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">");

/**
 * Every internal href/src of every built page: the file must exist inside the site and a
 * #fragment must name an id on the target page. External (scheme:) links are not followed.
 */
export function checkInternalLinks(siteDir: string): { pages: number; links: number; broken: BrokenLink[] } {
  const root = resolve(siteDir);
  const pages = htmlFiles(root);
  // The ids of recently targeted pages: links mostly point into their own page or a sibling, so
  // a small cache serves nearly all of them, and the check's memory does not grow with the site.
  const idsOf = new Map<string, Set<string>>();
  const ids = (file: string) => {
    let set = idsOf.get(file);
    if (!set) {
      set = new Set(
        attributeValues(readPage(file), "id")
          .filter((id) => id !== "")
          .map(decodeEntities),
      );
      if (idsOf.size >= maxCachedPages) idsOf.delete(idsOf.keys().next().value!);
      idsOf.set(file, set);
    }
    return set;
  };
  const broken: BrokenLink[] = [];
  let links = 0;
  for (const page of pages) {
    const html = readPage(page);
    const values = [...attributeValues(html, "href"), ...attributeValues(html, "src")];
    const rel = relative(root, page);
    for (const value of values) {
      const href = decodeEntities(value);
      if (/^[a-z][a-z0-9+.-]*:/i.test(href) || href.startsWith("//")) continue;
      links++;
      const [pathPart, fragment] = href.split("#", 2);
      let target = pathPart === "" ? page : resolve(dirname(page), pathPart.split("?")[0]);
      if (pathPart.endsWith("/") || (existsSync(target) && statSync(target).isDirectory())) target = join(target, "index.html");
      if (!target.startsWith(root)) {
        broken.push({ page: rel, href, reason: "points outside the site" });
        continue;
      }
      if (!existsSync(target)) {
        broken.push({ page: rel, href, reason: "no such file" });
        continue;
      }
      if (fragment && target.endsWith(".html") && !ids(target).has(decodeURIComponent(fragment)))
        broken.push({ page: rel, href, reason: `no id "${fragment}" on the target page` });
    }
  }
  return { pages: pages.length, links, broken };
}
