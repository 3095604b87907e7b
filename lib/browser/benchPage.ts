// The bench page's script: the visitor's cell and instrument -> transmittance plot and
// calibration-grade lines, computed here in the browser by the same atlas/core functions the CLI
// uses (cellLinesOfModel, cellSpectrum, calibrationLines). Loaded as an external file (the CSP
// allows no inline script); every text is written with textContent, never innerHTML.
import { cellLinesOfModel, lengthUnitsCm, maxCellPressurePa, pressureUnitsPa, type CellLineSet, type CellModel } from "../atlas/index.ts";
import {
  calibrationLines,
  cellSpectrum,
  CoreInputError,
  nearestGridIndex,
  relativeThinAbsorbance,
  type CalibrationLine,
  type CellConditions,
  type CellSpectrum,
  type Instrument,
} from "../core/index.ts";
import { spectrumWavenumberDigits, transmittanceDigits } from "../format/spectrumCells.ts";
import { benchCommands, benchQuery, instrumentOf, readBenchSettings, type BenchSettings } from "../format/benchSettings.ts";
import { drawSpectrumPlot, type PlotSeries } from "./spectrumPlot.ts";
import { el } from "./dom.ts";
import { calibrationTable } from "./benchCalibrationTable.ts";

const root = document.documentElement.dataset.root ?? "";

interface Computed {
  settings: BenchSettings;
  set: CellLineSet;
  spectrum: CellSpectrum;
  lines: CalibrationLine[];
  ms: number;
}

function compute(model: CellModel, settings: BenchSettings): Computed {
  const started = performance.now();
  const conditions: CellConditions = {
    temperatureK: settings.temperatureK,
    pressurePa: settings.pressure * pressureUnitsPa[settings.pressureUnit],
    pathCm: settings.path * lengthUnitsCm[settings.pathUnit],
    moleFraction: settings.moleFraction,
  };
  if (conditions.pressurePa > maxCellPressurePa) throw new CoreInputError("above 100 atm the ideal-gas and Voigt models mean nothing: lower the pressure");
  const instrument: Instrument = instrumentOf(settings);
  const set = cellLinesOfModel(model, conditions);
  const spectrum = cellSpectrum({ lines: set.lines, conditions, intensityScale: set.intensityScale, fromCm: settings.fromCm, toCm: settings.toCm, instrument });
  const lines = calibrationLines(set.lines, spectrum, settings.resolutionCm);
  return { settings, set, spectrum, lines, ms: performance.now() - started };
}

/** What the plot and the probe show: T seen by the instrument, or the relative thin absorbance. */
function shownSignal(c: Computed): { values: Float64Array; label: string; digits: (v: number) => string; absolute: boolean } {
  const s = c.spectrum;
  if (s.observedTransmittance) return { values: s.observedTransmittance, label: "transmittance", digits: transmittanceDigits, absolute: true };
  return {
    values: relativeThinAbsorbance(s),
    label: "relative absorbance (optically thin, peak = 1), not a transmittance",
    digits: transmittanceDigits,
    absolute: false,
  };
}

function setup(page: HTMLElement, model: CellModel) {
  const form = document.getElementById("bench-form") as HTMLFormElement;
  const status = document.getElementById("bench-status")!;
  const plot = document.getElementById("bench-plot")!;
  const probeOut = document.getElementById("bench-probe")!;
  const notes = document.getElementById("bench-notes")!;
  const list = document.getElementById("bench-list")!;
  const share = document.getElementById("bench-share") as HTMLAnchorElement;
  const defaults = JSON.parse(page.dataset.defaults!) as BenchSettings;
  let current: Computed | null = null;

  const fillForm = (s: BenchSettings) => {
    for (const [k, v] of Object.entries(s)) {
      const field = form.elements.namedItem(k) as HTMLInputElement | HTMLSelectElement | null;
      if (field && v !== null && v !== undefined) field.value = String(v);
    }
  };
  const formQuery = () => new URLSearchParams(new FormData(form) as unknown as Record<string, string>);

  const showProbe = (c: Computed, wavenumber: number | null) => {
    const signal = shownSignal(c);
    if (wavenumber === null || !Number.isFinite(wavenumber)) return probeOut.replaceChildren("Click the plot, or give a wavenumber, to read a value.");
    const s = c.spectrum;
    const first = s.grid.startCm + s.windowFirst * s.grid.stepCm;
    const last = s.grid.startCm + s.windowLast * s.grid.stepCm;
    if (wavenumber < first || wavenumber > last)
      return probeOut.replaceChildren(`${wavenumber} cm⁻¹ is outside the range shown (${c.settings.fromCm} to ${c.settings.toCm} cm⁻¹).`);
    const i = nearestGridIndex(s.grid, wavenumber);
    const nu = s.grid.startCm + i * s.grid.stepCm;
    const value = el("strong", signal.digits(signal.values[i]), { id: "bench-probe-value" });
    const parts: Array<string | Node> = [
      `At ν̃ = `,
      el("span", spectrumWavenumberDigits(nu), { id: "bench-probe-wavenumber" }),
      ` cm⁻¹: ${signal.absolute ? "transmittance seen by the instrument" : "relative absorbance"} `,
      value,
    ];
    if (s.transmittance) parts.push(` (monochromatic ${transmittanceDigits(s.transmittance[i])})`);
    probeOut.replaceChildren(...parts, ".");
  };

  const render = (c: Computed) => {
    const signal = shownSignal(c);
    const s = c.spectrum;
    const series: PlotSeries = { startCm: s.grid.startCm, stepCm: s.grid.stepCm, first: s.windowFirst, last: s.windowLast, values: signal.values };
    drawSpectrumPlot(plot, series, {
      yLabel: signal.absolute ? "transmittance T" : "relative absorbance",
      yUnit: signal.absolute ? "" : "(peak = 1)",
      absolute: signal.absolute,
      marks: c.lines.map((l) => ({ wavenumber: l.wavenumber, label: `${l.label} ${l.species}` })),
      title: `${model.moleculeName}: ${signal.label} at ${c.settings.resolutionCm} cm⁻¹`,
      onPick: (nu) => {
        (form.elements.namedItem("at") as HTMLInputElement).value = nu.toFixed(3);
        history.replaceState(null, "", "?" + formQuery().toString());
        share.href = location.href;
        showProbe(c, nu);
      },
    });
    const noteItems = [...c.set.notes];
    notes.replaceChildren(...noteItems.map((n) => el("li", n)));
    notes.hidden = noteItems.length === 0;
    list.replaceChildren(calibrationTable(c));
    showProbe(c, c.settings.at);
    const commands = benchCommands(model.moleculeId, c.settings);
    document.getElementById("bench-cli-spectrum")!.textContent =
      commands.spectrum + (c.set.intensityScale === "absolute" ? " --format csv" : " --relative --format csv");
    document.getElementById("bench-cli-calibration")!.textContent = commands.calibration;
    status.replaceChildren(
      `Computed in ${Math.round(c.ms)} ms in your browser: ${c.set.lines.length} lines of ${c.set.bandsUsed.length} band${c.set.bandsUsed.length === 1 ? "" : "s"}, ${s.windowLast - s.windowFirst + 1} points at ${s.grid.stepCm.toPrecision(3)} cm⁻¹.`,
    );
    status.classList.remove("error");
    page.dataset.state = "ready";
    page.dataset.resolution = String(c.settings.resolutionCm);
  };

  const run = (settings: BenchSettings) => {
    page.dataset.state = "computing";
    status.replaceChildren("Computing…");
    status.classList.remove("error");
    // Two frames: the "Computing…" text is painted before the (synchronous) computation starts.
    requestAnimationFrame(() =>
      requestAnimationFrame(() => {
        try {
          current = compute(model, settings);
          render(current);
        } catch (error) {
          page.dataset.state = "error";
          status.replaceChildren(
            error instanceof CoreInputError || error instanceof RangeError ? error.message : `Could not compute: ${(error as Error).message}`,
          );
          status.classList.add("error");
        }
      }),
    );
  };

  const fromLocation = () => {
    const { settings, problems } = readBenchSettings(new URLSearchParams(location.search), defaults);
    fillForm(settings);
    share.href = location.href;
    if (problems.length) {
      status.replaceChildren(problems.join(" "));
      status.classList.add("error");
      page.dataset.state = "error";
      return;
    }
    run(settings);
  };

  form.addEventListener("submit", (event) => {
    event.preventDefault();
    const query = formQuery();
    const { settings, problems } = readBenchSettings(query, defaults);
    if (problems.length) {
      status.replaceChildren(problems.join(" "));
      status.classList.add("error");
      page.dataset.state = "error";
      return;
    }
    history.pushState(null, "", "?" + benchQuery(settings).toString());
    share.href = location.href;
    run(settings);
  });
  // A changed choice (resolution, line shape, unit) recomputes at once; typed numbers on Enter.
  form.addEventListener("change", (event) => {
    if ((event.target as HTMLElement).tagName === "SELECT") form.requestSubmit();
  });
  (document.getElementById("bench-reset") as HTMLButtonElement).addEventListener("click", () => {
    history.pushState(null, "", location.pathname);
    fromLocation();
  });
  (form.elements.namedItem("at") as HTMLInputElement).addEventListener("change", (event) => {
    if (!current) return;
    const v = Number((event.target as HTMLInputElement).value);
    history.replaceState(null, "", "?" + formQuery().toString());
    share.href = location.href;
    showProbe(current, (event.target as HTMLInputElement).value.trim() === "" ? null : v);
  });
  window.addEventListener("popstate", fromLocation);
  fromLocation();
}

async function start() {
  const page = document.getElementById("bench");
  if (!page) return;
  const status = document.getElementById("bench-status")!;
  try {
    const response = await fetch(root + page.dataset.model!);
    if (!response.ok) throw new Error(`could not load the line data (${response.status})`);
    const model = (await response.json()) as CellModel;
    (document.getElementById("bench-form") as HTMLFormElement).hidden = false;
    document.getElementById("bench-waiting")?.remove();
    setup(page, model);
  } catch (error) {
    page.dataset.state = "error";
    status.replaceChildren(`The bench could not start: ${(error as Error).message}`);
    status.classList.add("error");
  }
}

if (document.readyState === "loading") document.addEventListener("DOMContentLoaded", () => void start());
else void start();
