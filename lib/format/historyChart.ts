import { axisTicks } from "../shared/axisTicks.ts";
import type { ControlLimits } from "../core/index.ts";
import type { ChartItem, ChartScene } from "./chartScene.ts";
import type { HistoryPoint, HistorySeries } from "./calibrationHistory.ts";

const ink = "#222222";
const soft = "#666666";
const toleranceFill = "#dcebd5";
const limitColour = "#1f5fa6";
const breakColour = "#b4530a";

const dayMs = 86_400_000;
const dayOf = (date: string) => Date.parse(`${date}T00:00:00Z`) / dayMs;
const dateOf = (day: number) => new Date(Math.round(day) * dayMs).toISOString().slice(0, 10);

interface Panel {
  title: string;
  unit: string;
  value: (p: HistoryPoint) => number;
  expanded: (p: HistoryPoint) => number;
  limits: ControlLimits | null;
  tolerance: number | null;
  digits: number;
}

function panelItems(series: HistorySeries, panel: Panel, left: number, top: number, width: number, height: number, days: [number, number]): ChartItem[] {
  const items: ChartItem[] = [];
  const { points } = series;
  let low = Infinity;
  let high = -Infinity;
  const take = (v: number) => {
    low = Math.min(low, v);
    high = Math.max(high, v);
  };
  for (const p of points) {
    take(panel.value(p) - panel.expanded(p));
    take(panel.value(p) + panel.expanded(p));
  }
  if (panel.tolerance !== null) [-panel.tolerance, panel.tolerance].forEach(take);
  if (panel.limits) [panel.limits.lower, panel.limits.upper].forEach(take);
  take(0);
  const pad = (high - low) * 0.08 || 1;
  low -= pad;
  high += pad;
  const y = (v: number) => top + height - ((v - low) / (high - low)) * height;
  const x = (day: number) => left + ((day - days[0]) / (days[1] - days[0])) * width;

  if (panel.tolerance !== null) {
    items.push({ kind: "rect", x: left, y: y(panel.tolerance), w: width, h: y(-panel.tolerance) - y(panel.tolerance), fill: toleranceFill, stroke: null });
    items.push({
      kind: "text",
      x: left + 4,
      y: y(panel.tolerance) + 10,
      text: `tolerance ±${panel.tolerance.toPrecision(3)} ${panel.unit}`,
      size: 8.5,
      anchor: "start",
      colour: "#3b6e2a",
    });
  }
  const ticks = axisTicks(low, high, 5);
  for (const t of ticks.values) {
    items.push({ kind: "line", x1: left - 4, y1: y(t), x2: left, y2: y(t), stroke: ink, width: 0.8 });
    items.push({ kind: "text", x: left - 6, y: y(t) + 3, text: t.toFixed(ticks.decimals).replace("-", "−"), size: 8.5, anchor: "end", colour: ink });
  }
  items.push({ kind: "line", x1: left, y1: y(0), x2: left + width, y2: y(0), stroke: soft, width: 0.6 });
  if (panel.limits) {
    const l = panel.limits;
    items.push({ kind: "line", x1: left, y1: y(l.mean), x2: left + width, y2: y(l.mean), stroke: limitColour, width: 1, dash: [6, 3] });
    for (const v of [l.lower, l.upper])
      items.push({ kind: "line", x1: left, y1: y(v), x2: left + width, y2: y(v), stroke: limitColour, width: 0.8, dash: [2, 2] });
    items.push({
      kind: "text",
      x: left + width - 4,
      y: y(l.upper) - 3,
      text: `mean ${l.mean.toFixed(panel.digits)} ± 3 SD (${l.count} runs)`,
      size: 8.5,
      anchor: "end",
      colour: limitColour,
    });
  }
  for (const p of points) {
    const cx = x(dayOf(p.date));
    const v = panel.value(p);
    const e = panel.expanded(p);
    items.push({ kind: "line", x1: cx, y1: y(v - e), x2: cx, y2: y(v + e), stroke: ink, width: 0.9 });
    for (const end of [v - e, v + e]) items.push({ kind: "line", x1: cx - 3, y1: y(end), x2: cx + 3, y2: y(end), stroke: ink, width: 0.9 });
    if (p.breaksTrend) {
      const cy = y(v);
      items.push({
        kind: "polygon",
        points: [
          [cx, cy - 6],
          [cx + 6, cy],
          [cx, cy + 6],
          [cx - 6, cy],
        ],
        fill: breakColour,
        stroke: ink,
      });
      // The label goes to the side with room, so a late run's label stays inside the frame.
      const onLeft = cx > left + width * 0.6;
      const label = `line ${p.line}: breaks the trend`;
      items.push({
        kind: "text",
        x: onLeft ? cx - 9 : cx + 9,
        y: cy + 3,
        text: label,
        size: 8.5,
        anchor: onLeft ? "end" : "start",
        colour: breakColour,
        bold: true,
      });
    } else items.push({ kind: "circle", cx, cy: y(v), r: 3, fill: p.verdict === "fail" ? "#ffffff" : ink, stroke: ink });
  }
  items.push({ kind: "rect", x: left, y: top, w: width, h: height, fill: null, stroke: ink, width: 0.8 });
  items.push({
    kind: "text",
    x: left - 44,
    y: top + height / 2,
    text: `${panel.title} / ${panel.unit}`,
    size: 9.5,
    anchor: "middle",
    colour: ink,
    rotate: true,
  });
  return items;
}

/**
 * The history chart of one instrument: k (and c when offsets were fitted) against the date of
 * measurement, each run with its ± U (k = 2) bar, the tolerance band, the mean ± 3 SD of the
 * instrument's runs and the runs that break the trend. Pure: the CLI, the PDF and the page draw it.
 */
export function historyChartScene(series: HistorySeries): ChartScene {
  const width = 720;
  const left = 78;
  const right = 24;
  const panelHeight = 220;
  const top = 44;
  const gap = 36;
  const panels: Panel[] = [
    {
      title: "scale k",
      unit: "ppm",
      value: (p) => p.kPpm,
      expanded: (p) => p.kExpandedPpm,
      limits: series.kLimits,
      tolerance: series.toleranceScalePpm,
      digits: 2,
    },
  ];
  if (series.showOffset)
    panels.push({
      title: "offset c",
      unit: "cm⁻¹",
      value: (p) => p.cCm,
      expanded: (p) => p.cExpandedCm,
      limits: series.cLimits,
      tolerance: series.toleranceOffsetCm,
      digits: 4,
    });
  const dayNumbers = series.points.map((p) => dayOf(p.date));
  let first = Math.min(...dayNumbers);
  let last = Math.max(...dayNumbers);
  if (!Number.isFinite(first)) first = last = 0;
  const margin = Math.max(2, (last - first) * 0.05);
  const days: [number, number] = [first - margin, last + margin];
  const plotWidth = width - left - right;
  const items: ChartItem[] = [
    { kind: "text", x: left, y: 18, text: `Wavenumber-scale history of ${series.instrument}`, size: 13, anchor: "start", colour: ink, bold: true },
    {
      kind: "text",
      x: left,
      y: 33,
      text: `${series.points.length} runs; bars ± U (k = 2); shaded: tolerance; dashed: mean ± 3 SD; ◆ breaks the trend; open circle: verdict fail`,
      size: 8.5,
      anchor: "start",
      colour: soft,
    },
  ];
  panels.forEach((panel, i) => items.push(...panelItems(series, panel, left, top + i * (panelHeight + gap), plotWidth, panelHeight, days)));
  const axisY = top + panels.length * panelHeight + (panels.length - 1) * gap;
  const tickCount = Math.min(6, Math.max(1, Math.round(days[1] - days[0])));
  for (let i = 0; i <= tickCount; i++) {
    const day = days[0] + ((days[1] - days[0]) * i) / tickCount;
    const x = left + (plotWidth * i) / tickCount;
    items.push({ kind: "line", x1: x, y1: axisY, x2: x, y2: axisY + 4, stroke: ink, width: 0.8 });
    items.push({ kind: "text", x, y: axisY + 15, text: dateOf(day), size: 8.5, anchor: "middle", colour: ink });
  }
  items.push({ kind: "text", x: left + plotWidth / 2, y: axisY + 30, text: "date of measurement", size: 9.5, anchor: "middle", colour: ink });
  return {
    width,
    height: axisY + 40,
    title: `Wavenumber-scale history of ${series.instrument}: k${series.showOffset ? " and c" : ""} against date, ± U (k = 2), tolerance band, mean ± 3 SD`,
    items,
  };
}
