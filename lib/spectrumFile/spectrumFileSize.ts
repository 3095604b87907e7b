import { SpectrumFileError } from "./spectrumFileError.ts";

/** An FTIR export of a few hundred thousand points is a few MB; far larger is not a single spectrum. */
export const maxSpectrumFileBytes = 50 * 1024 * 1024;

/** Refuses a file before it is read into memory (the CLI knows the size from stat, the browser from File.size). */
export function checkSpectrumFileSize(fileName: string, bytes: number): void {
  if (bytes > maxSpectrumFileBytes) {
    const mb = (bytes / (1024 * 1024)).toFixed(1);
    throw new SpectrumFileError(`${fileName} is ${mb} MB, more than the ${maxSpectrumFileBytes / (1024 * 1024)} MB a spectrum file may have.`);
  }
}
