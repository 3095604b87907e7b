import * as vega from "vega";
import * as vegaLite from "vega-lite";

export function escapeXml(text: string): string {
  return text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&apos;");
}

/**
 * The spec with every inline `data: { values }` replaced by a named data source, and the values
 * by name. Plots of one kind differ only in their data, so the data-free spec is the cache key.
 */
function splitData(spec: unknown, values: Map<string, unknown[]>): unknown {
  if (Array.isArray(spec)) return spec.map((s) => splitData(s, values));
  if (spec === null || typeof spec !== "object") return spec;
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(spec)) {
    if (
      key === "data" &&
      value !== null &&
      typeof value === "object" &&
      Array.isArray((value as { values?: unknown }).values) &&
      Object.keys(value).length === 1
    ) {
      const name = `inline${values.size}`;
      values.set(name, (value as { values: unknown[] }).values);
      out.data = { name };
    } else out[key] = splitData(value, values);
  }
  return out;
}

/**
 * The parsed Vega runtime of each data-free spec, kept for the process: compiling Vega-Lite and
 * parsing the Vega spec took most of a plot's time. Every plot still gets a fresh View, so its
 * SVG depends on its own data only (a reused View reorders marks it updates rather than enters).
 */
const runtimes = new Map<string, vega.Runtime>();
const maxRuntimes = 256;

function runtimeFor(key: string, spec: unknown): vega.Runtime {
  let runtime = runtimes.get(key);
  if (!runtime) {
    if (runtimes.size >= maxRuntimes) runtimes.delete(runtimes.keys().next().value!);
    runtime = vega.parse(vegaLite.compile(spec as vegaLite.TopLevelSpec).spec);
    runtimes.set(key, runtime);
  }
  return runtime;
}

/**
 * Compiles a Vega-Lite spec and renders it headless (renderer "none", no canvas) to an SVG string,
 * marked as one image with its description as accessible name and <title>.
 */
export async function renderSpecToSvg(spec: Record<string, unknown>, description: string): Promise<string> {
  const values = new Map<string, unknown[]>();
  const shape = splitData(spec, values);
  const view = new vega.View(runtimeFor(JSON.stringify(shape), shape), { renderer: "none" });
  let raw: string;
  try {
    for (const [name, rows] of values) view.data(name, rows);
    raw = await view.toSVG();
  } finally {
    view.finalize();
  }
  // Vega writes full double precision; a hundredth of a pixel is far below what any screen or
  // printer resolves, and rounding halves the page weight.
  const svg = raw.replace(
    / (transform|d|x|y|x1|x2|y1|y2|width|height)="([^"]*)"/g,
    (_, name: string, value: string) => ` ${name}="${value.replace(/-?\d+\.\d{3,}/g, (n) => String(Math.round(Number(n) * 100) / 100))}"`,
  );
  const label = escapeXml(description);
  return svg.replace(/^<svg /, `<svg role="img" aria-label="${label}" `).replace(/^(<svg[^>]*>)/, `$1<title>${label}</title>`);
}
