import type { MeasuredSpectrum, SpectrumReadOptions } from "./measuredSpectrum.ts";
import { readCsv } from "./readCsv.ts";
import { readJcamp } from "./readJcamp.ts";
import { SpectrumFileError } from "./spectrumFileError.ts";
import { maxSpectrumFileBytes } from "./spectrumFileSize.ts";

/**
 * A measured spectrum from a file's text: JCAMP-DX when it starts with "##", a CSV/TSV of two
 * columns otherwise. Takes text, not a path, so the browser can read a dropped file the same way.
 */
export function readSpectrumText(text: string, fileName: string, options: SpectrumReadOptions = {}): MeasuredSpectrum {
  // Each UTF-16 unit is at least one byte of the file, so this never refuses a file checkSpectrumFileSize accepted.
  if (text.length > maxSpectrumFileBytes)
    throw new SpectrumFileError(`${fileName} is larger than the ${maxSpectrumFileBytes / (1024 * 1024)} MB a spectrum file may have.`);
  const content = text.replace(/^\uFEFF/, "");
  if (content.trim() === "") throw new SpectrumFileError(`${fileName} is empty.`);
  // A JCAMP-DX file opens with a labelled record ("##TITLE="); "## exported by …" is a CSV comment.
  return /^##\S[^=\n]*=/.test(content.trimStart()) ? readJcamp(content, fileName, options) : readCsv(content, fileName, options);
}
