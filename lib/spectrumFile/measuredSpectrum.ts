// The one shape every spectrum file is read into, whatever its format.

export type OrdinateKind = "transmittance" | "percent-transmittance" | "absorbance";
export type AbscissaUnit = "cm-1" | "um" | "nm";
/** Where a unit came from: written in the file, given by the user, or guessed from the values. */
export type UnitSource = "file" | "option" | "detected";

export interface SpectrumReadOptions {
  /** The x unit, overriding the file (`--x`). */
  abscissa?: AbscissaUnit;
  /** What the y values are, overriding the file (`--y`). */
  ordinate?: OrdinateKind;
}

export interface MeasuredSpectrum {
  fileName: string;
  format: "jcamp-dx" | "csv";
  /** Strictly ascending, vacuum cm⁻¹. */
  wavenumberCm: Float64Array;
  /** Decadic absorbance at each wavenumber. */
  absorbance: Float64Array;
  ordinate: OrdinateKind;
  ordinateFrom: UnitSource;
  abscissaUnit: AbscissaUnit;
  abscissaFrom: UnitSource;
  /** The instrument's resolution in cm⁻¹ when the file states it, else null. */
  resolutionCm: number | null;
  title: string | null;
  instrument: string | null;
  /** The date of measurement the file states (JCAMP-DX ##LONG DATE or ##DATE), YYYY-MM-DD, else null. */
  measuredOn: string | null;
  /** Sentences for the user: what was detected and how, what was repaired. */
  notes: string[];
}
