import type { BuildIdentity } from "../shared/buildIdentity.ts";

/** Which build made a sheet (the build's own identity type), printed so an old printout can be recognised. */
export type SheetBuildIdentity = BuildIdentity;

/**
 * The PDF's creation date: the build date, so a rebuild of the same commit gives the same bytes.
 * Outside a git checkout the build date is "unknown"; the Unix epoch then stands in, still fixed.
 */
export function buildDate(build: SheetBuildIdentity): Date {
  if (build.dateIso === "unknown") return new Date(0);
  const date = new Date(build.dateIso);
  if (!/^\d{4}-\d{2}-\d{2}/.test(build.dateIso) || Number.isNaN(date.getTime())) {
    throw new SheetInputError(`build date "${build.dateIso}" is not an ISO 8601 date such as 2025-03-14 or 2025-03-14T09:30:00Z`);
  }
  return date;
}

/** A request the sheet renderer cannot carry out (paper, date, output path); the message is for people. */
export class SheetInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "SheetInputError";
  }
}
