import type { CommandResult } from "../../shared/commandResult.ts";

export type { CommandResult };

/** What a command module gives: its help text and what it runs. */
export interface LoadedCommand {
  help: string;
  run: (args: string[]) => CommandResult | string | Promise<CommandResult | string>;
}

/**
 * A subcommand: its one-line summary, and its module, loaded only when the command runs (a
 * command's imports, such as PDFKit for sheets or Eleventy for the build, cost a second or more
 * to load; `bandatlas --help` and `bandatlas find` should not pay for the others).
 */
export interface Command {
  summary: string;
  load: () => Promise<LoadedCommand>;
}

/** Every subcommand, in the order `bandatlas --help` lists them. */
export const commands: Record<string, Command> = {
  lines: {
    summary: "predicted P and R lines of one band of one species",
    load: async () => {
      const m = await import("./lines.ts");
      return { help: m.linesHelp, run: m.runLines };
    },
  },
  find: {
    summary: "lines of the whole atlas near a wavenumber",
    load: async () => {
      const m = await import("./find.ts");
      return { help: m.findHelp, run: m.runFind };
    },
  },
  sheet: {
    summary: "printable PDF bench sheet of one gas at one temperature",
    load: async () => {
      const m = await import("./sheet.ts");
      return { help: m.sheetHelp, run: m.runSheet };
    },
  },
  spectrum: {
    summary: "predicted gas-cell transmittance at an instrument's resolution (CSV or JSON)",
    load: async () => {
      const m = await import("./spectrum.ts");
      return { help: m.spectrumHelp, run: m.runSpectrum };
    },
  },
  "calibration-lines": {
    summary: "strong, isolated lines to calibrate against at a resolution, with their peak shifts",
    load: async () => {
      const m = await import("./calibrationLines.ts");
      return { help: m.calibrationLinesHelp, run: m.runCalibrationLines };
    },
  },
  calibrate: {
    summary: "correct an instrument's wavenumber scale from a spectrum of a gas cell it recorded (JCAMP-DX or CSV)",
    load: async () => {
      const m = await import("./calibrate.ts");
      return { help: m.calibrateHelp, run: m.runCalibrate };
    },
  },
  history: {
    summary: "the runs of a calibration log (calibrate --log) as a table and a chart of k against date, with the trend",
    load: async () => {
      const m = await import("./history.ts");
      return { help: m.historyHelp, run: m.runHistory };
    },
  },
  fit: {
    summary: "fit a molecule file's constants to its cited measured lines (constants, uncertainties, correlations, residuals)",
    load: async () => {
      const m = await import("./fit.ts");
      return { help: m.fitHelp, run: m.runFit };
    },
  },
  check: {
    summary: "validate molecule files (file:line:column for every problem)",
    load: async () => {
      const m = await import("./check.ts");
      return { help: m.checkHelp, run: m.runCheck };
    },
  },
  build: {
    summary: "build the atlas website (pages, downloads, search, sheets) into site/",
    load: async () => {
      const m = await import("./build.ts");
      return { help: m.buildHelp, run: m.runBuild };
    },
  },
  serve: {
    summary: "build the site and serve it on localhost, rebuilding when molecule files change",
    load: async () => {
      const m = await import("./serve.ts");
      return { help: m.serveHelp, run: m.runServe };
    },
  },
  new: {
    summary: "start a new molecule file from the commented template",
    load: async () => {
      const m = await import("./new.ts");
      return { help: m.newHelp, run: m.runNew };
    },
  },
};
