import { createHash } from "node:crypto";
import type { Molecule } from "../molecules/index.ts";

/**
 * What a `bandatlas serve` session keeps between rebuilds: results that depend on one molecule
 * file alone (its atlas entries, their plots, ...), keyed by the loaded molecule's content, so a
 * save recomputes only the molecule that changed. The code cannot change under a running
 * session (modules load once), so equal content means equal results. Entries not used by the
 * latest build are dropped when it finishes (`endBuild`), so removed or edited molecules do not pile up.
 */
export class BuildCache {
  private values = new Map<string, { value: unknown; build: number }>();
  private build = 0;
  private counts = { reused: 0, computed: 0 };

  private key(kind: string, molecule: Molecule): string {
    return `${kind}\u0000${createHash("sha1").update(JSON.stringify(molecule)).digest("hex")}`;
  }

  /** Whether `kind` for this molecule's content is kept (forMolecule would not compute it). */
  has(kind: string, molecule: Molecule): boolean {
    return this.values.has(this.key(kind, molecule));
  }

  /** The value of `kind` for this molecule, computed once per distinct molecule content. */
  forMolecule<T>(kind: string, molecule: Molecule, compute: () => T): T {
    return this.remember(this.key(kind, molecule), compute, true);
  }

  /**
   * A result that depends on no molecule file and cannot change within the session (the browser
   * bundles: their sources load with the code). Not counted in lastBuild.
   */
  forSession<T>(kind: string, compute: () => T): T {
    return this.remember(`session\u0000${kind}`, compute, false);
  }

  private remember<T>(key: string, compute: () => T, counted: boolean): T {
    const hit = this.values.get(key);
    if (hit) {
      hit.build = this.build;
      if (counted) this.counts.reused++;
      return hit.value as T;
    }
    const value = compute();
    if (counted) this.counts.computed++;
    this.values.set(key, { value, build: this.build });
    // A failed computation is not remembered: the next build tries again.
    if (value instanceof Promise) value.catch(() => this.values.delete(key));
    return value;
  }

  /** Drops every kept result whose kind starts with `kindPrefix` (rendered pages, when a template changed). */
  forget(kindPrefix: string): void {
    for (const key of this.values.keys()) if (key.startsWith(kindPrefix)) this.values.delete(key);
  }

  /** Forgets what the build just finished did not use, and starts counting the next one. */
  endBuild(): void {
    for (const [key, entry] of this.values) if (entry.build !== this.build) this.values.delete(key);
    this.build++;
    this.lastBuild = this.counts;
    this.counts = { reused: 0, computed: 0 };
  }

  /** How many per-molecule results the last finished build reused and computed. */
  lastBuild = { reused: 0, computed: 0 };
}
