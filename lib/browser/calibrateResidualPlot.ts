// Residual (reference − corrected measured) of every line with a peak against its measured
// wavenumber, with ± σ bars: used lines filled, the others open. Words (axis titles, key, caption)
// and the range rule are the PDF report's (calibrationPlotWords): the y range covers every
// residual and the used lines' bars, and a longer bar is cut at the frame with an arrow. The x
// axis spans the spectra plot's range with its margins, so a line sits under its peak above.
import type { MeasuredCalibration } from "../atlas/index.ts";
import { calibrationPlotWords } from "../format/calibrationReportWords.ts";
import type { CalibrationRun } from "../format/spectrumCalibrationText.ts";
import { axisTicks } from "../shared/axisTicks.ts";
import { el } from "./dom.ts";

const svgNs = "http://www.w3.org/2000/svg";
const node = <K extends keyof SVGElementTagNameMap>(tag: K, attrs: Record<string, string | number>, text?: string): SVGElementTagNameMap[K] => {
  const n = document.createElementNS(svgNs, tag);
  for (const [k, v] of Object.entries(attrs)) n.setAttribute(k, String(v));
  if (text !== undefined) n.textContent = text;
  return n;
};

/** The spectra plot's width and margins (lib/browser/spectrumPlot.ts), less tall. */
const box = { width: 960, height: 280, left: 74, right: 18, top: 14, bottom: 52 };

export function drawResidualPlot(container: HTMLElement, caption: HTMLElement, run: CalibrationRun, rangeCm: { fromCm: number; toCm: number }): void {
  const { width, height, left, right, top, bottom } = box;
  const plotW = width - left - right;
  const plotH = height - top - bottom;
  const words = calibrationPlotWords(run);
  const calibration: MeasuredCalibration = run.calibration;
  const points = calibration.result.lines.flatMap((l) =>
    l.peak && l.residualCm !== null ? [{ x: l.peak.wavenumberCm, r: l.residualCm, s: l.sigmaCm ?? 0, line: l }] : [],
  );
  const ys = [0, ...points.map((p) => p.r), ...points.filter((p) => p.line.used).flatMap((p) => [p.r - p.s, p.r + p.s])];
  const span = Math.max(Math.max(...ys) - Math.min(...ys), 0.02);
  const lo = Math.min(...ys) - 0.08 * span;
  const hi = Math.max(...ys) + 0.08 * span;
  const sx = (nu: number) => left + ((nu - rangeCm.fromCm) / (rangeCm.toCm - rangeCm.fromCm)) * plotW;
  const sy = (v: number) => top + ((hi - Math.min(hi, Math.max(lo, v))) / (hi - lo)) * plotH;

  const root = node("svg", { viewBox: `0 0 ${width} ${height}`, role: "img", class: "spectrum-plot residual-plot", "aria-labelledby": "residual-plot-title" });
  root.append(node("title", { id: "residual-plot-title" }, `${words.yTitle} against ${words.xTitle}: ${words.used}`));
  root.append(node("rect", { x: left, y: top, width: plotW, height: plotH, class: "frame" }));
  const xt = axisTicks(rangeCm.fromCm, rangeCm.toCm, 10);
  const yt = axisTicks(lo, hi, 6);
  for (const t of xt.values) root.append(node("text", { x: sx(t), y: top + plotH + 19, "text-anchor": "middle", class: "tick-label" }, t.toFixed(xt.decimals)));
  for (const t of yt.values) {
    root.append(node("line", { x1: left, x2: left + plotW, y1: sy(t), y2: sy(t), class: t === 0 ? "zero" : "grid" }));
    root.append(node("text", { x: left - 8, y: sy(t) + 4, "text-anchor": "end", class: "tick-label" }, t.toFixed(yt.decimals).replace("-", "−")));
  }
  root.append(node("text", { x: left + plotW / 2, y: height - 10, "text-anchor": "middle", class: "axis-label" }, words.xTitle));
  root.append(
    node("text", { x: 16, y: top + plotH / 2, "text-anchor": "middle", transform: `rotate(-90 16 ${top + plotH / 2})`, class: "axis-label" }, words.yTitle),
  );

  // The used lines last, over the others: the fit is what the eye should find first.
  for (const p of [...points.filter((q) => !q.line.used), ...points.filter((q) => q.line.used)]) {
    const g = node("g", { class: p.line.used ? "used" : "rejected" });
    const x = sx(p.x);
    const [y1, y2] = [sy(p.r + p.s), sy(p.r - p.s)];
    g.append(node("line", { x1: x, x2: x, y1, y2, class: "bar" }));
    if (p.r + p.s > hi) g.append(node("path", { d: `M${x},${y1}l-4,7h8z`, class: "cut" }));
    if (p.r - p.s < lo) g.append(node("path", { d: `M${x},${y2}l-4,-7h8z`, class: "cut" }));
    g.append(node("circle", { cx: x, cy: sy(p.r), r: 4 }));
    const why = p.line.used ? "used in the fit" : (words.rejected.find((r) => r.reason === p.line.reason)?.words ?? "not used");
    g.append(node("title", {}, `${p.line.reference.species} ${p.line.reference.label}: ${p.r.toFixed(4)} ± ${p.s.toPrecision(2)} cm⁻¹, ${why}`));
    root.append(g);
  }
  container.replaceChildren(root);
  const key = [
    el("span", `● ${words.used}`, { class: "key used" }),
    ...words.rejected.map((r) => el("span", `○ ${r.words} (${r.count})`, { class: "key rejected" })),
  ];
  caption.replaceChildren(el("span", undefined, { class: "keys" }), words.caption);
  caption.firstElementChild!.append(...key);
}
