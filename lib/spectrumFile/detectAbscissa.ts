import type { AbscissaUnit } from "./measuredSpectrum.ts";
import { rangeText } from "./numberText.ts";
import { SpectrumFileError } from "./spectrumFileError.ts";

// Mid-infrared to near-ultraviolet wavenumbers; micrometre wavelengths of the infrared lie far
// below, so the two ranges cannot be mistaken for each other. Nanometres (1000–2500 nm in the
// near infrared) do overlap: that is why the note names the `--x` override.
const wavenumberRangeCm = [200, 50_000] as const;
const micrometreRange = [0.5, 100] as const;

/** The x unit of values whose file does not name one, with the note saying how it was chosen. */
export function detectAbscissaUnit(fileName: string, x: ArrayLike<number>): { unit: AbscissaUnit; note: string } {
  const range = rangeText(x);
  const within = ([low, high]: readonly [number, number]) => Array.prototype.every.call(x, (v: number) => v >= low && v <= high);
  if (within(wavenumberRangeCm)) {
    return {
      unit: "cm-1",
      note: `The x values (${range}) carry no unit; they were read as wavenumbers in cm⁻¹ because they all lie between 200 and 50 000 (give --x um or --x nm if they are wavelengths).`,
    };
  }
  if (within(micrometreRange)) {
    throw new SpectrumFileError(`${fileName}: the x values (${range}) look like micrometres, but the file does not say; give --x um (or --x cm-1)`);
  }
  throw new SpectrumFileError(`${fileName}: the x values (${range}) carry no unit and are not clearly wavenumbers; give --x cm-1, --x um or --x nm`);
}
