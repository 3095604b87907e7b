import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { join } from "node:path";

/**
 * What a built page or sheet says about where it came from. Deliberately no clock time: two builds
 * of the same commit give byte-identical output, so the date is the commit's date.
 */
export interface BuildIdentity {
  /** package.json version. */
  version: string;
  /** Full git commit hash, or "unknown" outside a git checkout. */
  commit: string;
  /** Commit date, ISO 8601 (git %cI), or "unknown". */
  dateIso: string;
}

function git(repoDir: string, args: string[]): string | null {
  try {
    return execFileSync("git", args, { cwd: repoDir, encoding: "utf8", stdio: ["ignore", "pipe", "ignore"] }).trim() || null;
  } catch {
    return null;
  }
}

export function buildIdentity(repoDir: string): BuildIdentity {
  const pkg = JSON.parse(readFileSync(join(repoDir, "package.json"), "utf8")) as { version?: string };
  return {
    version: pkg.version ?? "0.0.0",
    commit: git(repoDir, ["rev-parse", "HEAD"]) ?? "unknown",
    dateIso: git(repoDir, ["log", "-1", "--format=%cI"]) ?? "unknown",
  };
}

/** The short form printed in page footers and sheet corners: "0.1.0 · dffe883 · 2025-11-26". */
export function describeBuild(build: BuildIdentity): string {
  const commit = build.commit === "unknown" ? "commit unknown" : build.commit.slice(0, 7);
  const date = build.dateIso === "unknown" ? "date unknown" : build.dateIso.slice(0, 10);
  return `bandatlas ${build.version} · ${commit} · ${date}`;
}
