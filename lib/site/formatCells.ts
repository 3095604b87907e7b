import type { Line } from "../core/index.ts";
import { lineCells } from "../format/index.ts";

export { signedSignificant } from "../format/index.ts";

/** The cells of one table row on a page: the same digits as the CSV, text dashes for "none". */
export function pageLineCells(line: Line) {
  const c = lineCells(line);
  return { ...c, lineIntensity: c.lineIntensity || "—" };
}

const superscriptDigits = "⁰¹²³⁴⁵⁶⁷⁸⁹";

/** A species label as chemists write it: 12C16O → ¹²C¹⁶O (plain text, no markup needed). */
export function speciesDisplay(label: string): string {
  return label.replace(/(\d+)(?=[A-Z])/g, (digits) => [...digits].map((d) => superscriptDigits[Number(d)]).join(""));
}
