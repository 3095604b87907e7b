// JCAMP-DX infrared spectra, decoded by jcampconverter.
//
// jcampconverter is pinned to 10.0.2, the last MIT-licensed release: later versions moved to a
// non-commercial licence and pull in openchemlib, which a spectrum reader has no use for.
import { convert, type Entry } from "jcampconverter";
import { buildSpectrum } from "./buildSpectrum.ts";
import { jcampMeasuredOn } from "./jcampDate.ts";
import { jcampAbscissa } from "./jcampGrid.ts";
import { resolutionInCm } from "./jcampResolution.ts";
import type { MeasuredSpectrum, SpectrumReadOptions } from "./measuredSpectrum.ts";
import { SpectrumFileError } from "./spectrumFileError.ts";
import { abscissaUnitFromWords, abscissaUnitTexts, ordinateFromWords } from "./unitWords.ts";

/** Labels under which exporters name the instrument, after jcampconverter drops spaces and upper-cases them. */
const instrumentLabels = ["SPECTROMETER/DATASYSTEM", "SPECTROMETER", "INSTRUMENT", "INSTRUMENTNAME"];

function record(entry: Entry, label: string): string | undefined {
  const value = entry.info[label];
  if (value === undefined) return undefined;
  const text = (Array.isArray(value) ? value.join(" ") : String(value)).trim();
  return text === "" ? undefined : text;
}

/** Refuses what is not one infrared XY spectrum, naming what it is instead. */
function theOneSpectrum(fileName: string, entries: Entry[]): { entry: Entry; spectrum: Entry["spectra"][number] } {
  const withData = entries.filter((e) => e.spectra.length > 0);
  if (entries.length > 1 || withData.some((e) => e.spectra.length > 1)) {
    throw new SpectrumFileError(
      `${fileName} holds ${Math.max(entries.length - 1, withData.length, 2)} blocks of data; bandatlas reads JCAMP-DX files that hold one spectrum.`,
    );
  }
  const entry = entries[0];
  const dataType = String(entry.dataType ?? record(entry, "DATATYPE") ?? "");
  if (/NMR|MASS/i.test(dataType)) throw new SpectrumFileError(`${fileName} is not an infrared spectrum (##DATA TYPE=${dataType}).`);
  if (Object.keys(entry.ntuples ?? {}).length > 0 || record(entry, "NTUPLES") !== undefined || entry.twoD) {
    throw new SpectrumFileError(`${fileName} holds NTUPLES (multi-dimensional) data; bandatlas reads ##XYDATA spectra.`);
  }
  const spectrum = entry.spectra[0];
  if (spectrum?.isPeaktable || record(entry, "PEAKTABLE") !== undefined || /PEAK/i.test(dataType)) {
    throw new SpectrumFileError(`${fileName} is a peak table, not a measured spectrum; give the full spectrum (##XYDATA).`);
  }
  if (record(entry, "XYPOINTS") !== undefined) {
    throw new SpectrumFileError(`${fileName} stores its points as ##XYPOINTS, which bandatlas does not read; export it as ##XYDATA=(X++(Y..Y)).`);
  }
  if (!spectrum?.isXYdata) throw new SpectrumFileError(`${fileName} has no ##XYDATA=(X++(Y..Y)) block, so there is no spectrum in it.`);
  return { entry, spectrum };
}

export function readJcamp(text: string, fileName: string, options: SpectrumReadOptions = {}): MeasuredSpectrum {
  let entries: Entry[];
  try {
    entries = convert(text, { keepRecordsRegExp: /.*/, dynamicTyping: false }).flatten;
  } catch (error) {
    throw new SpectrumFileError(`${fileName} could not be read as JCAMP-DX (${error instanceof Error ? error.message : String(error)}).`);
  }
  if (entries.length === 0) throw new SpectrumFileError(`${fileName} has no JCAMP-DX block in it.`);
  const { entry, spectrum } = theOneSpectrum(fileName, entries);

  const firstX = Number(spectrum.firstX);
  const lastX = Number(spectrum.lastX);
  const nPoints = Number(spectrum.nbPoints);
  if (![firstX, lastX, nPoints].every(Number.isFinite) || nPoints < 2) {
    throw new SpectrumFileError(`${fileName} lacks a numeric ##FIRSTX, ##LASTX or ##NPOINTS, so the x values of its XYDATA cannot be placed.`);
  }
  const y = Float64Array.from(spectrum.data.y ?? []);

  const xWords = record(entry, "XUNITS");
  const xUnit = xWords === undefined ? undefined : abscissaUnitFromWords(xWords);
  if (xWords !== undefined && xUnit === undefined && !options.abscissa) {
    throw new SpectrumFileError(
      `${fileName}: ##XUNITS=${xWords} is not a wavenumber or wavelength unit (1/CM, MICROMETERS, NANOMETERS); give --x if the values are one.`,
    );
  }
  const yWords = record(entry, "YUNITS");
  const yKind = yWords === undefined ? undefined : ordinateFromWords(yWords);
  const notes: string[] = [];
  if (yWords !== undefined && yKind === undefined && !options.ordinate)
    notes.push(`##YUNITS=${yWords} is not transmittance or absorbance; the y values were judged by their range.`);

  const unitText = abscissaUnitTexts[options.abscissa ?? xUnit ?? "cm-1"];
  const grid = jcampAbscissa(fileName, text, { firstX, lastX, nPoints, xFactor: Number(spectrum.xFactor ?? 1) }, y.length, unitText);
  notes.push(...grid.notes);

  const measured = buildSpectrum(
    {
      fileName,
      format: "jcamp-dx",
      x: grid.x,
      y,
      placeOf: (index) => `${fileName} point ${index + 1} of the XYDATA`,
      abscissa: xUnit && { unit: xUnit, words: xWords! },
      ordinate: yKind && { kind: yKind, words: yWords! },
      title: record(entry, "TITLE") ?? null,
      instrument: instrumentLabels.map((label) => record(entry, label)).find((value) => value !== undefined) ?? null,
      notes,
    },
    options,
  );
  const resolution = resolutionInCm(record(entry, "RESOLUTION"), measured.abscissaUnit, measured.wavenumberCm);
  const measuredOn = jcampMeasuredOn(record(entry, "LONGDATE"), record(entry, "DATE"));
  const moreNotes = [resolution.note, measuredOn.note].filter((n): n is string => typeof n === "string");
  return { ...measured, resolutionCm: resolution.resolutionCm, measuredOn: measuredOn.date, notes: [...measured.notes, ...moreNotes] };
}
