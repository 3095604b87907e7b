// Text spectra: two numeric columns, with whatever instruments put around them.
import { buildSpectrum } from "./buildSpectrum.ts";
import { detectLayout, layoutDescription, splitRows } from "./csvLayout.ts";
import type { MeasuredSpectrum, SpectrumReadOptions } from "./measuredSpectrum.ts";
import { isInfinityWord, parseNumberField } from "./numberText.ts";
import { SpectrumFileError } from "./spectrumFileError.ts";
import { regularizedAbscissa } from "./regularGrid.ts";
import { abscissaUnitFromWords, abscissaUnitTexts, ordinateFromWords } from "./unitWords.ts";

const isComment = (fields: string[]) => fields.length > 0 && /^(#|\/\/)/.test(fields[0]);
const isBlank = (fields: string[]) => fields.every((field) => field === "");

/** Drops the empty fields a trailing delimiter leaves, telling whether there were any. */
function withoutTrailingEmpty(fields: string[]): string[] {
  let end = fields.length;
  while (end > 0 && fields[end - 1] === "") end--;
  return end === fields.length ? fields : fields.slice(0, end);
}

export function readCsv(text: string, fileName: string, options: SpectrumReadOptions = {}): MeasuredSpectrum {
  const lines = text.split(/\r\n|\n|\r/);
  const layout = detectLayout(lines);
  if (layout === "no data") throw new SpectrumFileError(`${fileName} does not look like a spectrum: no line starts with a number.`);
  if (layout === "one column") throw new SpectrumFileError(`${fileName} has only one column of numbers; a spectrum needs two (x and y).`);
  const rows = splitRows(lines, layout);
  const number = (field: string | undefined) => (field === undefined ? undefined : parseNumberField(field, layout.decimalComma));
  const numberOrBadNumber = (field: string | undefined) =>
    field !== undefined && (number(field) !== undefined || /^[+-]?nan$/i.test(field) || isInfinityWord(field));

  // The data start at the first line holding two values that are numbers (or a NaN/inf, which is
  // bad data, not text); everything before is title, comments and the column header.
  const dataStart = rows.findIndex((fields) => !isComment(fields) && number(fields[0]) !== undefined && numberOrBadNumber(fields[1]));
  if (dataStart < 0) throw new SpectrumFileError(`${fileName} does not look like a spectrum: no line holds two numbers (x and y).`);

  const notes = [layoutDescription(layout)];
  let headerIndex = dataStart - 1;
  while (headerIndex >= 0 && (isBlank(rows[headerIndex]) || isComment(rows[headerIndex]))) headerIndex--;
  const header = headerIndex >= 0 ? withoutTrailingEmpty(rows[headerIndex]) : [];
  const abscissaUnit = header.length >= 2 ? abscissaUnitFromWords(header[0]) : undefined;
  const ordinate = header.length >= 2 ? ordinateFromWords(header[1]) : undefined;
  if (header.length >= 2) {
    const said = [abscissaUnit && `x in ${abscissaUnitTexts[abscissaUnit]}`, ordinate && `y ${ordinate.replace("-", " ")}`].filter(Boolean).join(", ");
    notes.push(`Line ${headerIndex + 1} was read as the column header ("${header[0]}", "${header[1]}"): ${said || "it names no unit"}.`);
  }
  const skipped = rows.slice(0, dataStart).filter((fields) => !isBlank(fields)).length;
  if (skipped > 0)
    notes.push(`${skipped} line${skipped === 1 ? "" : "s"} before the data (title, comments, header) ${skipped === 1 ? "was" : "were"} not read as data.`);

  const x: number[] = [];
  const y: number[] = [];
  const lineOf: number[] = [];
  let trailingEmpty = 0;
  let xDecimals = 0;
  for (let i = dataStart; i < rows.length; i++) {
    if (isBlank(rows[i]) || isComment(rows[i])) continue;
    const fields = withoutTrailingEmpty(rows[i]);
    if (fields.length < rows[i].length) trailingEmpty++;
    const place = `${fileName} line ${i + 1}`;
    if (fields.length === 1) throw new SpectrumFileError(`${place}: only one value ("${fields[0]}"); each data line needs an x and a y value.`);
    if (fields.length > 2) throw new SpectrumFileError(`${place}: ${fields.length} values where two columns (x and y) are expected.`);
    const values = fields.map((field) => {
      const value = number(field);
      if (value === undefined) throw new SpectrumFileError(`${place}: "${field}" is not ${isInfinityWord(field) ? "a finite number" : "a number"}.`);
      if (!Number.isFinite(value)) throw new SpectrumFileError(`${place}: "${field}" is not a finite number.`);
      return value;
    });
    x.push(values[0]);
    y.push(values[1]);
    xDecimals = Math.max(xDecimals, /[.,](\d+)(?:$|[eE])/.exec(fields[0])?.[1].length ?? 0);
    lineOf.push(i + 1);
  }
  if (trailingEmpty > 0)
    notes.push(`${trailingEmpty === x.length ? "Every data line" : `${trailingEmpty} data lines`} ended with a delimiter; the empty last column was ignored.`);

  // Only plain decimals say how x was rounded; an exponent form says nothing about the grid.
  const even = x.length && !/e/i.test(rows[dataStart][0]) ? regularizedAbscissa(Float64Array.from(x), xDecimals) : null;
  if (even) notes.push(even.note);
  return buildSpectrum(
    {
      fileName,
      format: "csv",
      x: even ? even.x : Float64Array.from(x),
      y: Float64Array.from(y),
      placeOf: (index) => `${fileName} line ${lineOf[index]}`,
      abscissa: abscissaUnit && { unit: abscissaUnit, words: header[0] },
      ordinate: ordinate && { kind: ordinate, words: header[1] },
      title: null,
      instrument: null,
      notes,
    },
    options,
  );
}
