import { closeSync, linkSync, mkdirSync, openSync, readFileSync, statSync, writeFileSync, writeSync } from "node:fs";
import { dirname, join } from "node:path";

/**
 * Writes the files of a build into its fresh folder. Given the previous build's folder (while
 * serving), a file whose bytes equal the previous one's is hard-linked from it instead: a profile
 * of rebuilds after one saved molecule file found writing the unchanged rest of the site (about
 * 500 files, 17 MB) to be 0.3 s of a 0.8 s rebuild. The previous folder is removed by the swap,
 * which only drops its names, so the linked files live on in the new one.
 */
export class SiteWriter {
  private made = new Set<string>();
  /** Files written, and files linked from the previous build. */
  readonly counts = { written: 0, linked: 0 };

  constructor(
    private readonly root: string,
    private readonly previousRoot: string | null = null,
  ) {}

  /** The file's full path, its folder made (once per folder). */
  private target(path: string): string {
    const target = join(this.root, path);
    const dir = dirname(target);
    if (!this.made.has(dir)) {
      mkdirSync(dir, { recursive: true });
      this.made.add(dir);
    }
    return target;
  }

  write(path: string, data: string | Uint8Array): void {
    const target = this.target(path);
    if (this.previousRoot && this.linkIfSame(join(this.previousRoot, path), target, data)) {
      this.counts.linked++;
      return;
    }
    writeFileSync(target, data);
    this.counts.written++;
  }

  /** A large file written piece by piece (never linked); returns its size in bytes. */
  writeParts(path: string, parts: Iterable<string | Uint8Array>): number {
    const fd = openSync(this.target(path), "w");
    let size = 0;
    try {
      for (const part of parts) {
        const bytes = typeof part === "string" ? Buffer.from(part) : part;
        for (let at = 0; at < bytes.byteLength;) at += writeSync(fd, bytes, at);
        size += bytes.byteLength;
      }
    } finally {
      closeSync(fd);
    }
    this.counts.written++;
    return size;
  }

  private linkIfSame(previous: string, target: string, data: string | Uint8Array): boolean {
    const bytes = typeof data === "string" ? Buffer.from(data) : data;
    try {
      if (statSync(previous).size !== bytes.byteLength || !Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).equals(readFileSync(previous)))
        return false;
      linkSync(previous, target);
      return true;
    } catch {
      return false; // no previous file, or a file system without hard links: write it
    }
  }
}
