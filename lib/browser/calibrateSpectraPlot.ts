// The measured spectrum on its corrected scale against the predicted one: the bench page's plot
// (drawSpectrumPlot) draws the measured spectrum with its axes, and the prediction is laid over it
// on the same axes, read off the drawn frame and y ticks so the two can never disagree.
import type { MeasuredCalibration } from "../atlas/index.ts";
import { el } from "./dom.ts";
import { drawSpectrumPlot, type PlotSeries } from "./spectrumPlot.ts";

const svgNs = "http://www.w3.org/2000/svg";

/** y(x) at even steps from x[0] to x[last] (linear interpolation): the plot takes an even grid, and most files are one already. */
function evenSamples(x: Float64Array, y: Float64Array, scale: number): Float64Array {
  const n = x.length;
  const out = new Float64Array(n);
  const step = (x[n - 1] - x[0]) / (n - 1);
  let j = 0;
  for (let i = 0; i < n; i++) {
    const at = x[0] + i * step;
    while (j < n - 2 && x[j + 1] < at) j++;
    const f = x[j + 1] === x[j] ? 0 : Math.min(1, Math.max(0, (at - x[j]) / (x[j + 1] - x[j])));
    out[i] = (y[j] * (1 - f) + y[j + 1] * f) / scale;
  }
  return out;
}

/** The value → SVG y map of a drawn plot, from two of its y ticks (label and grid line at the same height). */
function yScaleOf(root: SVGSVGElement): (v: number) => number {
  const rows = [...root.querySelectorAll("line.grid")].filter((l) => l.getAttribute("y1") === l.getAttribute("y2"));
  const values = [...root.querySelectorAll('text.tick-label[text-anchor="end"]')].map((t) => Number(t.textContent));
  const first = { v: values[0], y: Number(rows[0].getAttribute("y1")) };
  const last = { v: values[values.length - 1], y: Number(rows[rows.length - 1].getAttribute("y1")) };
  return (v) => first.y + ((v - first.v) * (last.y - first.y)) / (last.v - first.v);
}

export function drawCalibrationSpectra(
  container: HTMLElement,
  caption: HTMLElement,
  calibration: MeasuredCalibration,
  gasName: string,
  onPick: (wavenumberCm: number) => void,
): void {
  const x = calibration.measured.wavenumberCm;
  const n = x.length;
  let peak = 0;
  for (let i = 0; i < n; i++) peak = Math.max(peak, calibration.measured.absorbance[i], calibration.predicted.absorbance[i]);
  const scale = peak > 0 ? peak : 1;
  const measured = evenSamples(x, calibration.measured.absorbance, scale);
  const predicted = evenSamples(x, calibration.predicted.absorbance, scale);
  const series: PlotSeries = { startCm: x[0], stepCm: (x[n - 1] - x[0]) / (n - 1), first: 0, last: n - 1, values: measured };
  const used = calibration.result.lines.filter((l) => l.used);
  drawSpectrumPlot(container, series, {
    title: `Measured spectrum on the corrected scale (blue) and the spectrum predicted for ${gasName} (orange)`,
    yLabel: "absorbance",
    yUnit: "(largest peak = 1)",
    absolute: false,
    marks: used.map((l) => ({
      wavenumber: l.reference.referenceCm ?? l.reference.wavenumber,
      label: `${l.reference.label} ${l.reference.species}, used in the fit`,
    })),
    onPick,
  });
  const root = container.querySelector("svg")!;
  const frame = root.querySelector("rect.frame")!;
  const left = Number(frame.getAttribute("x"));
  const width = Number(frame.getAttribute("width"));
  const sy = yScaleOf(root);
  let d = "";
  for (let i = 0; i < n; i++) d += `${i === 0 ? "M" : "L"}${(left + (i / (n - 1)) * width).toFixed(1)},${sy(predicted[i]).toFixed(1)}`;
  const path = document.createElementNS(svgNs, "path");
  path.setAttribute("d", d);
  path.setAttribute("class", "predicted");
  // Over the measured trace (where the two agree, only the prediction's thinner line shows the
  // difference), under the pointer overlay that reads the plot off.
  root.querySelector("path.signal")!.after(path);
  caption.replaceChildren(
    el("span", "━ measured", { class: "swatch measured" }),
    ": on the corrected scale, its median removed. ",
    el("span", "━ predicted", { class: "swatch predicted" }),
    `: for ${gasName} in this cell at ${calibration.resolutionCm} cm⁻¹ (${calibration.apodization} apodization), scaled by one factor to the measured peaks. Both are divided by the larger peak; ▼ marks the reference of each line used in the fit.`,
  );
}
