import { describe, expect, it } from "vitest";
import { atlasEntry } from "../lib/atlas/index.ts";
import { loadMoleculesOrThrow } from "../lib/molecules/index.ts";
import { bandOverviewDescription, bandOverviewSpec, bandOverviewSvg, escapeXml, logFloor, overviewPoints } from "../lib/plot/index.ts";
import { branchStyle } from "../lib/shared/branchStyle.ts";
import { shippedMoleculesDir } from "../lib/cli/moleculeSource.ts";

const molecules = loadMoleculesOrThrow(shippedMoleculesDir);
const co = molecules.find((m) => m.id === "co")!;
const co296 = atlasEntry(co, co.species[0], 296);
const co1000 = atlasEntry(co, co.species[0], 1000);

type Layer = { mark: { type: string }; encoding: Record<string, any>; data?: { values: any[] }; layer?: Layer[] };

describe("band overview spec", () => {
  it("is a pure function of the entry", () => {
    expect(JSON.stringify(bandOverviewSpec(co296, "linear"))).toBe(JSON.stringify(bandOverviewSpec(atlasEntry(co, co.species[0], 296), "linear")));
  });

  it("tells P from R by colour and by a second cue (stick pattern and marker shape)", () => {
    const spec = bandOverviewSpec(co296, "linear") as { layer: Layer[] };
    const [sticks, markers] = spec.layer;
    expect(sticks.encoding.color.scale.range[0]).not.toBe(sticks.encoding.color.scale.range[1]);
    expect(sticks.encoding.strokeDash.scale.range[0]).not.toEqual(sticks.encoding.strokeDash.scale.range[1]);
    expect(markers.encoding.shape.scale.range[0]).not.toBe(markers.encoding.shape.scale.range[1]);
    expect(sticks.encoding.color.scale.domain).toEqual([branchStyle.P.name, branchStyle.R.name]);
  });

  it("labels both axes with their units", () => {
    const spec = bandOverviewSpec(co296, "linear") as { layer: Layer[] };
    expect(spec.layer[0].encoding.x.title).toBe("wavenumber / cm⁻¹");
    expect(spec.layer[0].encoding.y.title).toBe("relative intensity");
    expect((bandOverviewSpec(co296, "log") as { layer: Layer[] }).layer[0].encoding.y.scale.type).toBe("log");
  });

  it("marks the band origin of CO at 2143.27 cm⁻¹", () => {
    const spec = bandOverviewSpec(co296, "linear") as { layer: Layer[] };
    const origin = spec.layer[2].data!.values[0].origin;
    // CO v=1-0 band origin 2143.27 cm⁻¹ (fact of the trade, from memory); it must lie between
    // P(1) and R(0) of the Maki CRC table cited in molecules/co.yaml.
    expect(origin).toBeCloseTo(2143.271, 2);
    expect(origin).toBeGreaterThan(2139.426071); // P(1), Maki CRC table
    expect(origin).toBeLessThan(2147.081132); // R(0), Maki CRC table
  });

  it("scales the fundamental to 1 and hot bands to their strength relative to it", () => {
    const points296 = overviewPoints(co296);
    expect(Math.max(...points296.map((p) => p.intensity))).toBe(1);
    // At 296 K no CO hot band reaches 1e-3 of the fundamental (v=1 population ~ exp(-2143·1.4388/296) ≈ 3e-5).
    expect(new Set(points296.map((p) => p.band))).toEqual(new Set(["1-0 fundamental"]));
    const points1000 = overviewPoints(co1000);
    const hot = co1000.bands.find((b) => b.label === "2-1")!;
    expect(hot.shownWithFundamental).toBe(true);
    const hotMax = Math.max(...points1000.filter((p) => p.band === "2-1 hot band").map((p) => p.intensity));
    expect(hotMax).toBeCloseTo(hot.strengthRelativeToFundamental!, 12);
    // Boltzmann estimate of the v=1/v=0 ratio at 1000 K, exp(-hcν/kT) with ν ≈ 2143 cm⁻¹ and c2 =
    // 1.4388 cm K (CODATA), times 2 for |μ21|² = 2|μ10|² (harmonic rule): ≈ 0.092. Loose check.
    expect(hotMax).toBeGreaterThan(0.06);
    expect(hotMax).toBeLessThan(0.13);
  });

  it("leaves lines below the floor off the log plot", () => {
    const spec = bandOverviewSpec(co1000, "log") as { layer: Layer[] };
    const values = spec.layer[0].data!.values as Array<{ intensity: number }>;
    expect(values.length).toBeGreaterThan(50);
    expect(Math.min(...values.map((v) => v.intensity))).toBeGreaterThanOrEqual(logFloor);
    expect(overviewPoints(co1000).some((p) => p.intensity < logFloor)).toBe(true);
  });
});

describe("band overview SVG", () => {
  it("is one image with an accessible name that says what it shows, and has axes", async () => {
    const svg = await bandOverviewSvg(co296, "linear");
    expect(svg.startsWith('<svg role="img" aria-label="Stick spectrum of the 1-0 band of 12C16O at 296 K')).toBe(true);
    expect(svg).toContain(`<title>${escapeXml(bandOverviewDescription(co296, "linear"))}</title>`);
    expect(svg).toContain(">wavenumber / cm⁻¹</text>");
    expect(svg).toContain(">relative intensity</text>");
    // The origin with its ± (the larger ± of P(1) and R(0)), rounded to it.
    expect(svg).toMatch(/band origin 2143\.27\d* ± 0\.\d+ cm⁻¹/);
    // One stick per line of the fundamental.
    expect(svg.match(/<line /g)!.length).toBeGreaterThanOrEqual(co296.bands[0].lines.lines.length);
    expect(svg).not.toMatch(/ id="/); // no ids that could clash when several SVGs share a page
  });

  it("renders the same bytes twice", async () => {
    expect(await bandOverviewSvg(co296, "log")).toBe(await bandOverviewSvg(co296, "log"));
  });

  it("escapes text for XML", () => {
    expect(escapeXml(`<script>"a" & 'b'</script>`)).toBe("&lt;script&gt;&quot;a&quot; &amp; &apos;b&apos;&lt;/script&gt;");
  });
});
