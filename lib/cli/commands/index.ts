import type { CommandResult } from "../../shared/commandResult.ts";
import { checkHelp, runCheck } from "./check.ts";
import { findHelp, runFind } from "./find.ts";
import { linesHelp, runLines } from "./lines.ts";
import { runSheet, sheetHelp } from "./sheet.ts";
import { newHelp, runNew } from "./new.ts";
import { buildHelp, runBuild } from "./build.ts";
import { runServe, serveHelp } from "./serve.ts";
import { runSpectrum, spectrumHelp } from "./spectrum.ts";
import { calibrationLinesHelp, runCalibrationLines } from "./calibrationLines.ts";
import { fitHelp, runFit } from "./fit.ts";
import { calibrateHelp, runCalibrate } from "./calibrate.ts";

export type { CommandResult };

export interface Command {
  summary: string;
  help: string;
  run: (args: string[]) => CommandResult | string | Promise<CommandResult | string>;
}

/** Every subcommand, in the order `bandatlas --help` lists them. */
export const commands: Record<string, Command> = {
  lines: { summary: "predicted P and R lines of one band of one species", help: linesHelp, run: runLines },
  find: { summary: "lines of the whole atlas near a wavenumber", help: findHelp, run: runFind },
  sheet: { summary: "printable PDF bench sheet of one gas at one temperature", help: sheetHelp, run: runSheet },
  spectrum: { summary: "predicted gas-cell transmittance at an instrument's resolution (CSV or JSON)", help: spectrumHelp, run: runSpectrum },
  "calibration-lines": {
    summary: "strong, isolated lines to calibrate against at a resolution, with their peak shifts",
    help: calibrationLinesHelp,
    run: runCalibrationLines,
  },
  calibrate: {
    summary: "correct an instrument's wavenumber scale from a spectrum of a gas cell it recorded (JCAMP-DX or CSV)",
    help: calibrateHelp,
    run: runCalibrate,
  },
  fit: {
    summary: "fit a molecule file's constants to its cited measured lines (constants, uncertainties, correlations, residuals)",
    help: fitHelp,
    run: runFit,
  },
  check: { summary: "validate molecule files (file:line:column for every problem)", help: checkHelp, run: runCheck },
  build: { summary: "build the atlas website (pages, downloads, search, sheets) into site/", help: buildHelp, run: runBuild },
  serve: { summary: "build the site and serve it on localhost, rebuilding when molecule files change", help: serveHelp, run: runServe },
  new: { summary: "start a new molecule file from the commented template", help: newHelp, run: runNew },
};
