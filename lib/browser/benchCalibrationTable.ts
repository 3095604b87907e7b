import type { CalibrationLine } from "../core/index.ts";
import { positionWithUncertainty, significant } from "../format/numbers.ts";
import { calibrationWavenumberDigits, peakShiftDigits } from "../format/spectrumCells.ts";
import type { BenchSettings } from "../format/benchSettings.ts";
import { el } from "./dom.ts";

/** The bench page's list of calibration-grade lines, as the CLI's calibration-lines prints them. */
export function calibrationTable(c: { settings: BenchSettings; lines: CalibrationLine[] }): HTMLElement {
  const wrap = el("div", undefined, { class: "table-wrap" });
  const table = el("table", undefined, { class: "lines calibration-lines", id: "bench-lines" });
  const none = c.lines.length === 0 ? " (a line must be strong, isolated, and known to R/50 inside a band validated against cited measured lines)" : "";
  const cap = el(
    "caption",
    `${c.lines.length} calibration-grade line${c.lines.length === 1 ? "" : "s"} at ${c.settings.resolutionCm} cm⁻¹ between ${c.settings.fromCm} and ${c.settings.toCm} cm⁻¹${none}`,
  );
  table.append(cap);
  const head = el("tr");
  for (const [name, unit] of [
    ["line", ""],
    ["species", ""],
    ["band", ""],
    ["wavenumber ν̃", "/ cm⁻¹"],
    ["± ν̃", "/ cm⁻¹"],
    ["strength", "(strongest line of the gas = 1)"],
    ["apparent peak", "/ cm⁻¹"],
    ["expected peak shift", "/ cm⁻¹"],
  ]) {
    const th = el("th", name, { scope: "col" });
    if (unit) th.append(el("br"), el("span", unit, { class: "unit" }));
    head.append(th);
  }
  table.append(el("thead"));
  table.tHead!.append(head);
  const body = el("tbody");
  for (const l of c.lines) {
    const tr = el("tr", undefined, { class: `branch-${l.label[0]}` });
    tr.append(
      el("th", l.label, { scope: "row" }),
      el("td", l.species),
      el("td", l.band),
      // As the CLI's calibration-lines: the position rounded to its ±, the ± beside it.
      el("td", positionWithUncertainty(l.wavenumber, l.wavenumberUncertainty).value),
      el("td", positionWithUncertainty(l.wavenumber, l.wavenumberUncertainty).sigma),
      el("td", significant(l.relativeToStrongest, 3)),
      el("td", l.apparentWavenumber === null ? "no peak" : calibrationWavenumberDigits(l.apparentWavenumber)),
      el("td", peakShiftDigits(l.peakShiftCm) || "no peak"),
    );
    body.append(tr);
  }
  table.append(body);
  wrap.append(table);
  return wrap;
}
