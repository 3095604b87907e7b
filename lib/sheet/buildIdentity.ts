/**
 * Which build made a sheet, printed on it so an old printout can be recognised. Structurally the
 * same as the build's identity type (lib/build/buildIdentity.ts, written by the build); declared
 * here so the sheet renderer does not wait for it.
 */
export interface SheetBuildIdentity {
  version: string;
  commit: string;
  /** ISO 8601 date or date-time; also the PDF's creation date, so a rebuild gives the same bytes. */
  dateIso: string;
}

/** The build date as a Date, or a plain error: a sheet without a valid date would not be reproducible. */
export function buildDate(build: SheetBuildIdentity): Date {
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
