import { existsSync, readdirSync, readFileSync, statSync } from "node:fs";
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
      set = new Set([...readFileSync(file, "utf8").matchAll(/\sid="([^"]+)"/g)].map((m) => decodeEntities(m[1])));
      if (idsOf.size >= maxCachedPages) idsOf.delete(idsOf.keys().next().value!);
      idsOf.set(file, set);
    }
    return set;
  };
  const broken: BrokenLink[] = [];
  let links = 0;
  for (const page of pages) {
    const html = readFileSync(page, "utf8");
    const rel = relative(root, page);
    for (const m of html.matchAll(/\s(?:href|src)="([^"]*)"/g)) {
      const href = decodeEntities(m[1]);
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
