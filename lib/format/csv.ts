/** A number already formatted to its printed digits: passed to CSV untouched. */
export interface NumericCell {
  digits: string;
}
export const numeric = (digits: string): NumericCell => ({ digits });

/**
 * One CSV cell (RFC 4180 quoting). Text cells that a spreadsheet would read as a formula
 * (leading =, +, -, @, tab or carriage return) get a leading apostrophe, as the OWASP note on
 * CSV injection advises; numeric cells are never altered.
 */
export function csvCell(value: string | number | NumericCell | null): string {
  if (value === null) return "";
  if (typeof value === "number") return Number.isFinite(value) ? String(value) : "";
  if (typeof value === "object") return value.digits;
  let text = value;
  if (/^[=+\-@\t\r]/.test(text)) text = "'" + text;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvRow(cells: Array<string | number | NumericCell | null>): string {
  return cells.map(csvCell).join(",");
}
