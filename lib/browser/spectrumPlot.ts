// A small SVG plot of a sampled spectrum, drawn in the browser: wavenumber axis in cm⁻¹, the
// signal as one path (min/max of the samples under each pixel column, so no line disappears when
// 100 000 samples meet 900 pixels), tick marks for the calibration-grade lines, a cursor read-out.
import { axisTicks } from "../shared/axisTicks.ts";

const svgNs = "http://www.w3.org/2000/svg";

export interface PlotSeries {
  startCm: number;
  stepCm: number;
  /** Indices of the first and last samples to draw. */
  first: number;
  last: number;
  values: Float64Array;
}

export interface PlotOptions {
  title: string;
  yLabel: string;
  yUnit: string;
  /** Transmittance (axis up to 1, dips down) rather than relative absorbance (0 to 1, peaks up). */
  absolute: boolean;
  marks: Array<{ wavenumber: number; label: string }>;
  onPick: (wavenumberCm: number) => void;
}

function svg<K extends keyof SVGElementTagNameMap>(tag: K, attrs: Record<string, string | number> = {}, text?: string): SVGElementTagNameMap[K] {
  const node = document.createElementNS(svgNs, tag);
  for (const [k, v] of Object.entries(attrs)) node.setAttribute(k, String(v));
  if (text !== undefined) node.textContent = text;
  return node;
}

const size = { width: 960, height: 400, left: 74, right: 18, top: 34, bottom: 52 };

export function drawSpectrumPlot(container: HTMLElement, series: PlotSeries, options: PlotOptions): void {
  const { width, height, left, right, top, bottom } = size;
  const plotW = width - left - right;
  const plotH = height - top - bottom;
  const x0 = series.startCm + series.first * series.stepCm;
  const x1 = series.startCm + series.last * series.stepCm;
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = series.first; i <= series.last; i++) {
    const v = series.values[i];
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  // Transmittance: from a little below the deepest dip to 1 (or above, where ILS ringing overshoots).
  let yLo: number;
  let yHi: number;
  if (options.absolute) {
    yHi = Math.max(1, hi);
    const depth = yHi - lo;
    yLo = depth > 0.5 ? Math.min(0, lo) : lo - 0.08 * Math.max(depth, 1e-4);
    yHi += 0.03 * Math.max(depth, 1e-4);
  } else {
    yLo = Math.min(0, lo);
    yHi = Math.max(1, hi) * 1.04;
  }
  const sx = (nu: number) => left + ((nu - x0) / (x1 - x0)) * plotW;
  const sy = (v: number) => top + ((yHi - v) / (yHi - yLo)) * plotH;

  const root = svg("svg", { viewBox: `0 0 ${width} ${height}`, role: "img", class: "spectrum-plot", "aria-labelledby": "bench-plot-title" });
  root.append(svg("title", { id: "bench-plot-title" }, `${options.title}, ${x0.toFixed(1)} to ${x1.toFixed(1)} cm⁻¹`));
  root.append(svg("rect", { x: left, y: top, width: plotW, height: plotH, class: "frame" }));

  const xt = axisTicks(x0, x1, 10);
  for (const t of xt.values) {
    const x = sx(t);
    root.append(svg("line", { x1: x, x2: x, y1: top, y2: top + plotH, class: "grid" }));
    root.append(svg("line", { x1: x, x2: x, y1: top + plotH, y2: top + plotH + 5, class: "tick" }));
    root.append(svg("text", { x, y: top + plotH + 19, "text-anchor": "middle", class: "tick-label" }, t.toFixed(xt.decimals)));
  }
  root.append(svg("text", { x: left + plotW / 2, y: height - 10, "text-anchor": "middle", class: "axis-label" }, "wavenumber ν̃ / cm⁻¹ (vacuum)"));
  const yt = axisTicks(yLo, yHi, 6);
  for (const t of yt.values) {
    const y = sy(t);
    root.append(svg("line", { x1: left, x2: left + plotW, y1: y, y2: y, class: "grid" }));
    root.append(svg("line", { x1: left - 5, x2: left, y1: y, y2: y, class: "tick" }));
    root.append(svg("text", { x: left - 8, y: y + 4, "text-anchor": "end", class: "tick-label" }, t.toFixed(yt.decimals)));
  }
  root.append(
    svg(
      "text",
      { x: 16, y: top + plotH / 2, "text-anchor": "middle", transform: `rotate(-90 16 ${top + plotH / 2})`, class: "axis-label" },
      `${options.yLabel} ${options.yUnit}`.trim(),
    ),
  );

  // One vertical stroke per pixel column, from the smallest to the largest sample under it.
  const columns = Math.round(plotW);
  const perColumn = (series.last - series.first + 1) / columns;
  let d = "";
  if (perColumn <= 2) {
    for (let i = series.first; i <= series.last; i++)
      d += `${i === series.first ? "M" : "L"}${sx(series.startCm + i * series.stepCm).toFixed(1)},${sy(series.values[i]).toFixed(1)}`;
  } else {
    for (let c = 0; c < columns; c++) {
      const a = series.first + Math.floor(c * perColumn);
      const b = Math.min(series.last, series.first + Math.floor((c + 1) * perColumn));
      let cMin = Infinity;
      let cMax = -Infinity;
      for (let i = a; i <= b; i++) {
        const v = series.values[i];
        if (v < cMin) cMin = v;
        if (v > cMax) cMax = v;
      }
      const x = (left + c + 0.5).toFixed(1);
      d += `${c === 0 ? "M" : "L"}${x},${sy(cMax).toFixed(1)}L${x},${sy(cMin).toFixed(1)}`;
    }
  }
  root.append(svg("path", { d, class: "signal" }));

  // Calibration-grade lines: a small triangle above the frame at each, named in its tooltip.
  const marks = svg("g", { class: "marks" });
  for (const m of options.marks) {
    if (m.wavenumber < x0 || m.wavenumber > x1) continue;
    const x = sx(m.wavenumber);
    const tri = svg("path", { d: `M${x.toFixed(1)},${top - 2}l-4,-8h8z` });
    tri.append(svg("title", {}, `${m.label}: calibration grade`));
    marks.append(tri);
  }
  root.append(marks);
  root.append(
    svg(
      "text",
      { x: left, y: 14, class: "mark-legend" },
      options.marks.length ? "▼ calibration-grade line (listed below)" : "no calibration-grade line in this range",
    ),
  );

  const cursor = svg("line", { x1: 0, x2: 0, y1: top, y2: top + plotH, class: "cursor", visibility: "hidden" });
  const readout = svg("text", { x: left + plotW, y: 14, "text-anchor": "end", class: "readout" });
  const overlay = svg("rect", { x: left, y: top, width: plotW, height: plotH, class: "overlay" });
  root.append(cursor, readout, overlay);
  const at = (event: PointerEvent | MouseEvent) => {
    const box = root.getBoundingClientRect();
    const x = ((event.clientX - box.left) / box.width) * width;
    const nu = x0 + ((x - left) / plotW) * (x1 - x0);
    return Math.min(x1, Math.max(x0, nu));
  };
  overlay.addEventListener("pointermove", (event) => {
    const nu = at(event);
    const i = Math.round((nu - series.startCm) / series.stepCm);
    cursor.setAttribute("x1", String(sx(nu)));
    cursor.setAttribute("x2", String(sx(nu)));
    cursor.setAttribute("visibility", "visible");
    readout.textContent = `ν̃ ${nu.toFixed(3)} cm⁻¹ · ${options.absolute ? "T" : "rel. absorbance"} ${series.values[i].toFixed(4)} · click to read off`;
  });
  overlay.addEventListener("pointerleave", () => {
    cursor.setAttribute("visibility", "hidden");
    readout.textContent = "";
  });
  overlay.addEventListener("click", (event) => options.onPick(at(event)));
  container.replaceChildren(root);
}
