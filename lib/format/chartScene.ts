// A chart as a list of drawing primitives in points (y down), so one layout is drawn the same way
// as SVG (the CLI's --out chart.svg, the website) and by PDFKit (the PDF), never laid out twice.

export type ChartItem =
  | { kind: "line"; x1: number; y1: number; x2: number; y2: number; stroke: string; width: number; dash?: number[] }
  | { kind: "rect"; x: number; y: number; w: number; h: number; fill: string | null; stroke: string | null; width?: number }
  | { kind: "circle"; cx: number; cy: number; r: number; fill: string; stroke: string }
  | { kind: "polygon"; points: Array<[number, number]>; fill: string; stroke: string }
  | { kind: "text"; x: number; y: number; text: string; size: number; anchor: "start" | "middle" | "end"; colour: string; bold?: boolean; rotate?: boolean };

export interface ChartScene {
  width: number;
  height: number;
  /** What the chart shows, in one sentence (the SVG's title, the page's alternative text). */
  title: string;
  items: ChartItem[];
}

const escapeXml = (text: string) => text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");
const n = (x: number) => (Math.round(x * 100) / 100).toString();

function itemSvg(item: ChartItem): string {
  switch (item.kind) {
    case "line":
      return `<line x1="${n(item.x1)}" y1="${n(item.y1)}" x2="${n(item.x2)}" y2="${n(item.y2)}" stroke="${item.stroke}" stroke-width="${n(item.width)}"${item.dash ? ` stroke-dasharray="${item.dash.join(" ")}"` : ""}/>`;
    case "rect":
      return `<rect x="${n(item.x)}" y="${n(item.y)}" width="${n(item.w)}" height="${n(item.h)}" fill="${item.fill ?? "none"}"${item.stroke ? ` stroke="${item.stroke}" stroke-width="${n(item.width ?? 1)}"` : ""}/>`;
    case "circle":
      return `<circle cx="${n(item.cx)}" cy="${n(item.cy)}" r="${n(item.r)}" fill="${item.fill}" stroke="${item.stroke}"/>`;
    case "polygon":
      return `<polygon points="${item.points.map(([x, y]) => `${n(x)},${n(y)}`).join(" ")}" fill="${item.fill}" stroke="${item.stroke}"/>`;
    case "text": {
      const transform = item.rotate ? ` transform="rotate(-90 ${n(item.x)} ${n(item.y)})"` : "";
      return `<text x="${n(item.x)}" y="${n(item.y)}" font-size="${n(item.size)}" text-anchor="${item.anchor}" fill="${item.colour}"${item.bold ? ` font-weight="bold"` : ""}${transform}>${escapeXml(item.text)}</text>`;
    }
  }
}

/** The scene as a standalone SVG document (text escaped; no script, no external reference). */
export function sceneSvg(scene: ChartScene): string {
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${scene.width}" height="${scene.height}" viewBox="0 0 ${scene.width} ${scene.height}" font-family="DejaVu Sans, Verdana, sans-serif" role="img">`,
    `<title>${escapeXml(scene.title)}</title>`,
    `<rect width="${scene.width}" height="${scene.height}" fill="#ffffff"/>`,
    ...scene.items.map(itemSvg),
    "</svg>",
    "",
  ].join("\n");
}
