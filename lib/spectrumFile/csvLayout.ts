// How the columns of a text spectrum are separated, decided from the lines that start like data.
import Papa from "papaparse";

export type CsvDelimiter = "," | "\t" | ";" | "whitespace";

export interface CsvLayout {
  delimiter: CsvDelimiter;
  /** "2650,12;0,0244": commas are decimal points when the columns are split by something else. */
  decimalComma: boolean;
}

const delimiterNames: Record<CsvDelimiter, string> = { ",": "commas", "\t": "tabs", ";": "semicolons", whitespace: "spaces" };

export function layoutDescription(layout: CsvLayout): string {
  return `Columns separated by ${delimiterNames[layout.delimiter]}${layout.decimalComma ? ", with decimal commas" : ""} (detected).`;
}

const startsLikeData = /^\s*[+-]?\.?\d/;

function delimiterOf(line: string): CsvDelimiter | "none" {
  if (line.includes("\t")) return "\t";
  if (line.includes(";")) return ";";
  if (line.includes(",")) return ",";
  return /\S\s+\S/.test(line.trim()) ? "whitespace" : "none";
}

/**
 * The delimiter most of the data-like lines use ("none" when they hold a single value each),
 * judged on the first 200 of them: free text before the data (an exporter's title line with
 * commas in it) is outvoted by the numbers.
 */
export function detectLayout(lines: string[]): CsvLayout | "one column" | "no data" {
  const sample = lines.filter((line) => startsLikeData.test(line)).slice(0, 200);
  if (sample.length === 0) return "no data";
  const votes = new Map<CsvDelimiter | "none", number>();
  for (const line of sample) votes.set(delimiterOf(line), (votes.get(delimiterOf(line)) ?? 0) + 1);
  const [winner] = [...votes.entries()].sort((a, b) => b[1] - a[1])[0];
  if (winner === "none") return "one column";
  const decimalComma = winner !== "," && sample.some((line) => /\d,\d/.test(line)) && !sample.some((line) => /\d\.\d/.test(line));
  return { delimiter: winner, decimalComma };
}

/** The fields of every line, trimmed, one array per line of the file (so row i is line i + 1). */
export function splitRows(lines: string[], layout: CsvLayout): string[][] {
  if (layout.delimiter === "whitespace") return lines.map((line) => (line.trim() === "" ? [] : line.trim().split(/\s+/)));
  const parsed = Papa.parse<string[]>(lines.join("\n"), { delimiter: layout.delimiter, newline: "\n", skipEmptyLines: false });
  // A stray quote in a text line can swallow the line break after it; parsing line by line (slower)
  // keeps every row on its own line so messages name the right one.
  const rows =
    parsed.data.length === lines.length ? parsed.data : lines.map((line) => Papa.parse<string[]>(line, { delimiter: layout.delimiter }).data[0] ?? []);
  return rows.map((fields) => fields.map((field) => field.trim()));
}
