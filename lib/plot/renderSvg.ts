import * as vega from "vega";
import * as vegaLite from "vega-lite";

export function escapeXml(text: string): string {
  return text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&apos;");
}

/**
 * Compiles a Vega-Lite spec and renders it headless (renderer "none", no canvas) to an SVG string,
 * marked as one image with its description as accessible name and <title>.
 */
export async function renderSpecToSvg(spec: Record<string, unknown>, description: string): Promise<string> {
  const compiled = vegaLite.compile(spec as unknown as vegaLite.TopLevelSpec).spec;
  const view = new vega.View(vega.parse(compiled), { renderer: "none" });
  try {
    // Vega writes full double precision; a hundredth of a pixel is far below what any screen or
    // printer resolves, and rounding halves the page weight.
    const svg = (await view.toSVG()).replace(/ (transform|d|x|y|x1|x2|y1|y2|width|height)="([^"]*)"/g, (_, name: string, value: string) =>
      ` ${name}="${value.replace(/-?\d+\.\d{3,}/g, (n) => String(Math.round(Number(n) * 100) / 100))}"`,
    );
    const label = escapeXml(description);
    return svg.replace(/^<svg /, `<svg role="img" aria-label="${label}" `).replace(/^(<svg[^>]*>)/, `$1<title>${label}</title>`);
  } finally {
    view.finalize();
  }
}
