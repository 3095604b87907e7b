import { readdirSync, statSync } from "node:fs";
import { join, relative } from "node:path";

export interface SiteStats {
  files: number;
  pages: number;
  totalBytes: number;
  largestPage: { path: string; bytes: number } | null;
}

/** Sizes of a built site as a person measuring it with `du -b` / `ls -l` would see them. */
export function siteStats(siteDir: string): SiteStats {
  const stats: SiteStats = { files: 0, pages: 0, totalBytes: 0, largestPage: null };
  const walk = (dir: string) => {
    for (const name of readdirSync(dir).sort()) {
      const path = join(dir, name);
      const info = statSync(path);
      if (info.isDirectory()) walk(path);
      else {
        stats.files++;
        stats.totalBytes += info.size;
        if (name.endsWith(".html")) {
          stats.pages++;
          if (!stats.largestPage || info.size > stats.largestPage.bytes) stats.largestPage = { path: relative(siteDir, path), bytes: info.size };
        }
      }
    }
  };
  walk(siteDir);
  return stats;
}
