// The checks and conversions every format shares, once its numbers are out of the file.
import { positionToWavenumber } from "../core/index.ts";
import { detectAbscissaUnit } from "./detectAbscissa.ts";
import { detectOrdinate } from "./detectOrdinate.ts";
import type { AbscissaUnit, MeasuredSpectrum, OrdinateKind, SpectrumReadOptions, UnitSource } from "./measuredSpectrum.ts";
import { rangeText, shortNumber } from "./numberText.ts";
import { SpectrumFileError } from "./spectrumFileError.ts";

/** Fewer points than this cannot hold even one resolved line with its baseline. */
export const minSpectrumPoints = 16;
/** A transmittance at or below zero is noise on a saturated line; 10⁻⁶ (absorbance 6) stands in for "black". */
const minTransmittance = 1e-6;

export interface RawSpectrum {
  fileName: string;
  format: MeasuredSpectrum["format"];
  /** As written, in the file's order and x unit. */
  x: Float64Array;
  y: Float64Array;
  /** Where point i is, to start a message: "scan.csv line 14". */
  placeOf: (index: number) => string;
  /** The units the file names, with the words it used (for the note when an option overrides them). */
  abscissa?: { unit: AbscissaUnit; words: string };
  ordinate?: { kind: OrdinateKind; words: string };
  title: string | null;
  instrument: string | null;
  notes: string[];
}

const ordinateNames: Record<OrdinateKind, string> = {
  transmittance: "transmittance",
  "percent-transmittance": "percent transmittance",
  absorbance: "absorbance",
};

function chooseAbscissa(raw: RawSpectrum, options: SpectrumReadOptions, notes: string[]): { unit: AbscissaUnit; from: UnitSource } {
  if (options.abscissa) {
    // A unit the file states is not overridden: the option would turn every line into another
    // (a wrong but confident correction), so a contradiction is refused.
    if (raw.abscissa && raw.abscissa.unit !== options.abscissa) {
      throw new SpectrumFileError(
        `${raw.fileName}: the file gives its x values as "${raw.abscissa.words}" (${raw.abscissa.unit}), which --x ${options.abscissa} contradicts; leave out --x to use the file's unit, or correct the file.`,
      );
    }
    return { unit: options.abscissa, from: "option" };
  }
  if (raw.abscissa) return { unit: raw.abscissa.unit, from: "file" };
  const detected = detectAbscissaUnit(raw.fileName, raw.x);
  notes.push(detected.note);
  return { unit: detected.unit, from: "detected" };
}

function chooseOrdinate(raw: RawSpectrum, options: SpectrumReadOptions, notes: string[]): { kind: OrdinateKind; from: UnitSource } {
  if (options.ordinate) {
    // Transmittance and percent transmittance are one quantity on two scales; absorbance is not.
    const family = (kind: OrdinateKind) => (kind === "absorbance" ? "absorbance" : "transmittance");
    if (raw.ordinate && family(raw.ordinate.kind) !== family(options.ordinate)) {
      throw new SpectrumFileError(
        `${raw.fileName}: the file gives its y values as "${raw.ordinate.words}" (${ordinateNames[raw.ordinate.kind]}), which --y ${options.ordinate} contradicts; leave out --y to use the file's label, or correct the file.`,
      );
    }
    if (raw.ordinate && raw.ordinate.kind !== options.ordinate) {
      notes.push(`The file gives the y values as "${raw.ordinate.words}"; --y ${options.ordinate} was used instead, as asked.`);
    }
    return { kind: options.ordinate, from: "option" };
  }
  if (raw.ordinate) {
    let maxY = -Infinity;
    for (const v of raw.y) maxY = Math.max(maxY, v);
    // Exporters label percent values "Transmittance" often enough; 0–1 values never reach 1.5.
    if (raw.ordinate.kind === "transmittance" && maxY > 1.5 && maxY <= 110) {
      notes.push(`The file says "${raw.ordinate.words}" but its values reach ${shortNumber(maxY)}, so they were read as percent transmittance.`);
      return { kind: "percent-transmittance", from: "file" };
    }
    return { kind: raw.ordinate.kind, from: "file" };
  }
  const detected = detectOrdinate(raw.y);
  notes.push(detected.note);
  return { kind: detected.kind, from: "detected" };
}

/** Checks the points, converts them to ascending cm⁻¹ and absorbance, and says what it did. */
export function buildSpectrum(raw: RawSpectrum, options: SpectrumReadOptions = {}): MeasuredSpectrum {
  const { fileName, x, y, placeOf } = raw;
  const count = x.length;
  if (count < minSpectrumPoints) {
    throw new SpectrumFileError(`${fileName}: only ${count} data point${count === 1 ? "" : "s"}; a spectrum needs at least ${minSpectrumPoints}.`);
  }
  for (let i = 0; i < count; i++) {
    if (!Number.isFinite(x[i]) || !Number.isFinite(y[i]))
      throw new SpectrumFileError(`${placeOf(i)}: the ${Number.isFinite(x[i]) ? "y" : "x"} value is not a finite number.`);
  }
  const notes = [...raw.notes];
  const abscissa = chooseAbscissa(raw, options, notes);
  const ordinate = chooseOrdinate(raw, options, notes);

  const wavenumberCm = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    if (!(x[i] > 0))
      throw new SpectrumFileError(
        `${placeOf(i)}: x = ${shortNumber(x[i])} ${abscissa.unit} is not a positive ${abscissa.unit === "cm-1" ? "wavenumber" : "wavelength"}.`,
      );
    wavenumberCm[i] = positionToWavenumber({ value: x[i], unit: abscissa.unit, medium: "vacuum" });
  }
  // One direction throughout; the first step sets it. A wavelength axis reverses it, which is fine.
  const ascending = wavenumberCm[1] > wavenumberCm[0];
  for (let i = 1; i < count; i++) {
    if (wavenumberCm[i] === wavenumberCm[i - 1]) {
      throw new SpectrumFileError(`${placeOf(i)}: x = ${shortNumber(x[i])} repeats the x value of the point before it; each x must appear once.`);
    }
    if (wavenumberCm[i] > wavenumberCm[i - 1] !== ascending) {
      throw new SpectrumFileError(
        `${placeOf(i)}: x = ${shortNumber(x[i])} breaks the ${ascending ? "rising" : "falling"} order of the x values before it; the points must run in one direction.`,
      );
    }
  }

  const absorbance = new Float64Array(count);
  let clamped = 0;
  for (let i = 0; i < count; i++) {
    if (ordinate.kind === "absorbance") {
      absorbance[i] = y[i];
      continue;
    }
    let transmittance = ordinate.kind === "percent-transmittance" ? y[i] / 100 : y[i];
    if (transmittance <= 0) {
      transmittance = minTransmittance;
      clamped++;
    }
    absorbance[i] = -Math.log10(transmittance);
  }
  if (clamped > 0) {
    notes.push(
      `${clamped} point${clamped === 1 ? " has" : "s have"} a transmittance at or below zero (noise on a saturated line); ${clamped === 1 ? "it was" : "they were"} set to 10⁻⁶, absorbance 6.`,
    );
  }
  if (ordinate.kind !== "absorbance") notes.push(`The ${ordinateNames[ordinate.kind]} T was turned into absorbance −log₁₀ T.`);
  if (!ascending) {
    wavenumberCm.reverse();
    absorbance.reverse();
    notes.push("The points run from high to low wavenumber in the file; they were put in ascending order.");
  }
  notes.push(`${count} points, ${rangeText(wavenumberCm)} cm⁻¹.`);
  return {
    fileName,
    format: raw.format,
    wavenumberCm,
    absorbance,
    ordinate: ordinate.kind,
    ordinateFrom: ordinate.from,
    abscissaUnit: abscissa.unit,
    abscissaFrom: abscissa.from,
    resolutionCm: null,
    title: raw.title,
    instrument: raw.instrument,
    measuredOn: null,
    notes,
  };
}
