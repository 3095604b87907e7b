import { bandOriginBound, type AtlasEntry } from "../atlas/index.ts";
import type { BandLines, Line } from "../core/index.ts";
import { fixed, positionWithUncertainty } from "../format/index.ts";
import { bandOriginColour, branchStyle } from "../shared/branchStyle.ts";

export type IntensityScale = "linear" | "log";

/** Lines weaker than this (relative to the strongest fundamental line) are left off the log plot. */
export const logFloor = 1e-4;

export interface OverviewPoint {
  wavenumber: number;
  intensity: number;
  branch: string;
  band: string;
  label: string;
}

/**
 * The sticks of the overview: the fundamental plus the hot bands the atlas shows with it, each
 * scaled to the strongest fundamental line (the atlas's band-strength ratio), so heights compare.
 */
export function overviewPoints(entry: AtlasEntry): OverviewPoint[] {
  const points: OverviewPoint[] = [];
  for (const band of entry.bands) {
    if (!band.shownWithFundamental || band.strengthRelativeToFundamental === null) continue;
    for (const line of band.lines.lines) {
      points.push({
        wavenumber: line.wavenumber,
        intensity: line.relativeIntensity * band.strengthRelativeToFundamental,
        branch: branchStyle[line.branch].name,
        band: band === entry.bands[0] ? `${band.label} ${band.kind}` : `${band.label} hot band`,
        label: line.label,
      });
    }
  }
  return points;
}

/** Vega-Lite spec of the band overview: a pure function of the entry's data. */
/** Positions on the plot are rounded to their ± like every printed position. */
function originText(band: BandLines): string {
  const sigma = bandOriginBound(band).uncertainty;
  if (sigma === null) return `${fixed(band.bandOrigin, 1)} cm⁻¹`;
  const w = positionWithUncertainty(band.bandOrigin, sigma);
  return `${w.value} ± ${w.sigma} cm⁻¹`;
}
function lineText(line: Line): string {
  const w = positionWithUncertainty(line.wavenumber, line.wavenumberUncertainty);
  return `${w.value} ± ${w.sigma} cm⁻¹`;
}

export function bandOverviewSpec(entry: AtlasEntry, scale: IntensityScale, size = { width: 720, height: 260 }): Record<string, unknown> {
  // The first band is the one the others are compared with (a diatomic's fundamental, a linear
  // molecule's first listed band, which may be a combination band).
  const fundamental = entry.bands[0];
  const all = overviewPoints(entry);
  const points = scale === "log" ? all.filter((p) => p.intensity >= logFloor) : all;
  const bands = [...new Set(points.map((p) => p.band))];
  const branchNames = [branchStyle.P.name, branchStyle.R.name];
  const y =
    scale === "log"
      ? {
          field: "intensity",
          type: "quantitative",
          title: "relative intensity (log scale)",
          scale: { type: "log", domain: [logFloor, 1] },
          axis: { values: [1e-4, 1e-3, 1e-2, 1e-1, 1], format: "~g", grid: true },
        }
      : { field: "intensity", type: "quantitative", title: "relative intensity", scale: { domain: [0, 1] }, axis: { grid: true } };
  const y2 = scale === "log" ? { datum: logFloor } : { datum: 0 };
  const x = { field: "wavenumber", type: "quantitative", title: "wavenumber / cm⁻¹", scale: { zero: false, nice: false }, axis: { format: "d", grid: false } };
  const branchColour = {
    field: "branch",
    type: "nominal",
    title: null,
    scale: { domain: branchNames, range: [branchStyle.P.colour, branchStyle.R.colour] },
    legend: { orient: "top", direction: "horizontal" },
  };
  const opacity =
    bands.length > 1
      ? {
          field: "band",
          type: "ordinal",
          sort: bands,
          title: null,
          scale: { domain: bands, range: bands.map((b, i) => (i === 0 ? 1 : 0.45)) },
          legend: { orient: "top", direction: "horizontal" },
        }
      : { value: 1 };
  return {
    $schema: "https://vega.github.io/schema/vega-lite/v6.json",
    width: size.width,
    height: size.height,
    background: "white",
    padding: 8,
    config: {
      aria: false,
      font: "sans-serif",
      axis: { labelFontSize: 11, titleFontSize: 12, titleFontWeight: "normal" },
      legend: { labelFontSize: 11, symbolStrokeWidth: 2 },
      view: { stroke: "#999" },
    },
    layer: [
      {
        data: { values: points },
        mark: { type: "rule", strokeWidth: 1.5, clip: false },
        encoding: {
          x,
          y,
          y2,
          color: branchColour,
          opacity,
          strokeDash: { field: "branch", type: "nominal", scale: { domain: branchNames, range: [branchStyle.P.dash, branchStyle.R.dash] }, title: null },
        },
      },
      {
        data: { values: points },
        mark: { type: "point", filled: true, size: 16, clip: false },
        encoding: {
          x,
          y,
          color: branchColour,
          opacity,
          shape: { field: "branch", type: "nominal", title: null, scale: { domain: branchNames, range: [branchStyle.P.shape, branchStyle.R.shape] } },
        },
      },
      {
        data: { values: [{ origin: fundamental.lines.bandOrigin, text: `band origin ${originText(fundamental.lines)}` }] },
        layer: [
          { mark: { type: "rule", strokeDash: [1, 3], strokeWidth: 1.5, color: bandOriginColour }, encoding: { x: { field: "origin", type: "quantitative" } } },
          {
            mark: { type: "text", align: "center", baseline: "bottom", dy: -4, fontSize: 11, color: bandOriginColour },
            encoding: { x: { field: "origin", type: "quantitative" }, y: { value: 0 }, text: { field: "text" } },
          },
        ],
      },
    ],
  };
}

/** What the plot shows, in words, for the aria-label and for readers who cannot see it. */
export function bandOverviewDescription(entry: AtlasEntry, scale: IntensityScale): string {
  const fundamental = entry.bands[0];
  const lines = fundamental.lines.lines;
  const hot = entry.bands.filter((b) => b.kind === "hot" && b.shownWithFundamental).map((b) => b.label);
  const strongest = lines.reduce((best, l) => (l.relativeIntensity > best.relativeIntensity ? l : best), lines[0]);
  const range = lines.length
    ? `${lines.length} lines from ${fixed(lines[0].wavenumber, 1)} to ${fixed(lines[lines.length - 1].wavenumber, 1)} cm⁻¹`
    : "no lines";
  return (
    `Stick spectrum of the ${fundamental.label} band of ${entry.species} at ${entry.temperatureK} K, intensity on a ${scale === "log" ? "logarithmic" : "linear"} scale: ` +
    `${range}, P branch (triangles, dashed) below and R branch (circles, solid) above the band origin at ${originText(fundamental.lines)}` +
    (strongest ? `; strongest line ${strongest.label} at ${lineText(strongest)}` : "") +
    (hot.length ? `; hot band${hot.length > 1 ? "s" : ""} ${hot.join(", ")} drawn paler` : "; no hot band reaches 0.001 of the strongest line") +
    "."
  );
}
