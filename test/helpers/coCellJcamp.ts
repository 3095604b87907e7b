// An invented CO cell spectrum written as JCAMP-DX (transmittance, XFACTOR/YFACTOR, ##RESOLUTION
// 0.5), made by the atlas's own cell model with a known scale error: the calibrate tests read it
// as an instrument's file. Invented data, not a measurement.
import { cellModel, defaultCellConditions, selectMolecule } from "../../lib/atlas/index.ts";
import { measuredSpectrum, seededRandom, trueSpectrum } from "../../lib/atlas/syntheticSpectrum.ts";
import { shippedMolecules } from "./shipped.ts";

export interface CoCellJcampOptions {
  /** true = measured·(1 + scale). */
  scale: number;
  seed: number;
  jcampVersion: "4.24" | "5.01";
  /** ##LONG DATE (date part), when the file should carry one. */
  longDate?: string;
  /** Write ##FIRSTY (4.24 readers check the first ordinate against it). */
  firstY?: boolean;
}

export function coCellJcamp(options: CoCellJcampOptions): string {
  const cell = cellModel(selectMolecule(shippedMolecules(), "co"));
  const truth = trueSpectrum(cell, defaultCellConditions, 0.5, "triangular", 1995, 2265);
  const error = { scale: options.scale, offsetCm: 0, noiseAbsorbance: 0.001, tiltPerCm: 0, baselineAbsorbance: 0 };
  const m = measuredSpectrum(truth, 2000, 2260, 0.125, error, seededRandom(options.seed));
  const y = Array.from(m.absorbance, (a) => Math.round(10 ** -a * 1e5));
  const rows: string[] = [];
  for (let i = 0; i < y.length; i += 10) rows.push(`${Math.round(m.wavenumberCm[i] * 1000)} ${y.slice(i, i + 10).join(" ")}`);
  return [
    "##TITLE=invented CO cell spectrum made by the bandatlas cell model",
    `##JCAMP-DX=${options.jcampVersion}`,
    "##DATA TYPE=INFRARED SPECTRUM",
    ...(options.longDate ? [`##LONG DATE=${options.longDate} 09:00:00`] : []),
    "##XUNITS=1/CM",
    "##YUNITS=TRANSMITTANCE",
    "##RESOLUTION=0.5",
    "##XFACTOR=0.001",
    "##YFACTOR=0.00001",
    `##FIRSTX=${m.wavenumberCm[0]}`,
    `##LASTX=${m.wavenumberCm[y.length - 1]}`,
    `##NPOINTS=${y.length}`,
    ...(options.firstY ? [`##FIRSTY=${y[0] * 1e-5}`] : []),
    "##XYDATA=(X++(Y..Y))",
    ...rows,
    "##END=",
  ].join("\n");
}
