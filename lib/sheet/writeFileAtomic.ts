import { existsSync, renameSync, statSync, unlinkSync, writeFileSync } from "node:fs";
import { basename, dirname, join, resolve } from "node:path";
import { threadId } from "node:worker_threads";
import { SheetInputError } from "./sheetInput.ts";

function reason(error: unknown, dir: string): string {
  const code = (error as NodeJS.ErrnoException | null)?.code;
  if (code === "ENOENT") return `the folder ${dir} does not exist`;
  if (code === "ENOTDIR") return `${dir} is not a folder`;
  if (code === "EACCES" || code === "EPERM") return `no permission to write in ${dir}`;
  if (code === "EROFS") return `${dir} is on a read-only file system`;
  if (code === "ENOSPC") return "the disk is full";
  return error instanceof Error ? error.message : String(error);
}

/**
 * Writes the whole file or nothing: the bytes go to a temporary file in the same folder, which is
 * renamed over the target (rename is atomic within one file system, POSIX rename(2)); on any
 * failure the temporary file is removed and a plain SheetInputError names what went wrong.
 */
export function writeFileAtomic(path: string, bytes: Uint8Array): void {
  const target = resolve(path);
  const dir = dirname(target);
  if (existsSync(target) && statSync(target).isDirectory()) {
    throw new SheetInputError(`cannot write ${path}: it is a folder; give a file name, e.g. ${join(path, "sheet.pdf")}`);
  }
  const temp = join(dir, `.${basename(target)}.${process.pid}-${threadId}.partial`);
  try {
    writeFileSync(temp, bytes, { flag: "wx" });
    renameSync(temp, target);
  } catch (error) {
    try {
      unlinkSync(temp);
    } catch {
      // nothing was created
    }
    throw new SheetInputError(`cannot write ${path}: ${reason(error, dir)}`);
  }
}
