import type { Line } from "../core/index.ts";
import { lineCells, significant } from "../format/index.ts";

/** A signed number for residual columns: "+0.0012", "−0.00034" (true minus sign). */
export function signedSignificant(value: number, digits: number): string {
  const text = significant(Math.abs(value), digits);
  return (value < 0 ? "−" : "+") + text;
}

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
