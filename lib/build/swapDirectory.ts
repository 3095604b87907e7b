import { existsSync, renameSync, rmSync } from "node:fs";

/**
 * Puts a finished build in place of the old one: the old folder is moved aside, the new one
 * renamed into its place (same parent folder, so a rename, not a copy), then the old one removed.
 * A reader sees either the old site or the new one, never a mixture.
 */
export function swapDirectory(finishedDir: string, targetDir: string): void {
  const aside = `${finishedDir}-previous`;
  if (existsSync(targetDir)) renameSync(targetDir, aside);
  try {
    renameSync(finishedDir, targetDir);
  } catch (error) {
    if (existsSync(aside)) renameSync(aside, targetDir);
    throw error;
  }
  rmSync(aside, { recursive: true, force: true });
}
