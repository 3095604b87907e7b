// Reading measured spectrum files (JCAMP-DX, CSV/TSV) from their text; no Node APIs, so the
// browser reads a dropped file with the same code.
export * from "./measuredSpectrum.ts";
export * from "./spectrumFileError.ts";
export * from "./spectrumFileSize.ts";
export * from "./readSpectrumText.ts";
export { calendarDate } from "./jcampDate.ts";
