// The estimate of what a truncated Dunham table leaves out (positionErrors.ts, omittedTermEstimates)
// checked where the truth is known: each band's ± must cover its known misses (|miss| ≤ ± for at
// least 95 % of the lines) without being useless (median ±/|miss| at most 5).
import { describe, expect, it } from "vitest";
import { bandLines, omittedTermComponents, omittedTerms, type DiatomicSpeciesModel, type DunhamCoefficient } from "../lib/core/index.ts";
import { shippedDiatomic } from "./helpers/shipped.ts";

/** A species with only the given table and the omitted-term estimate as its error. */
function truncated(species: DiatomicSpeciesModel, keep: (c: DunhamCoefficient) => boolean): DiatomicSpeciesModel {
  const dunham = species.dunham.filter(keep).map((c) => ({ ...c, uncertaintyCm: 0 }));
  return {
    ...species,
    dunham,
    positionErrors: omittedTermComponents(omittedTerms(dunham, null)),
    validation: undefined,
    referenceLines: [],
  };
}

interface Miss {
  label: string;
  missCm: number;
  sigmaCm: number;
}

function coverage(misses: Miss[]) {
  const covered = misses.filter((m) => Math.abs(m.missCm) <= m.sigmaCm).length / misses.length;
  const ratios = misses.map((m) => m.sigmaCm / Math.max(Math.abs(m.missCm), 1e-12)).sort((a, b) => a - b);
  return { covered, medianRatio: ratios[ratios.length >> 1] };
}

// The handbook's terms: ωe, ωexe, ωeye, Be, αe, γe, De, βe (Huber & Herzberg 1979, the columns of
// its table of diatomic constants; fact of the trade).
const handbookTerms = new Set(["10", "20", "30", "01", "11", "21", "02", "12"]);

describe("omitted Dunham terms: the ± covers the known misses", () => {
  it("12C16O cut to the handbook's terms, against the full mass-independent set of Farrenq et al. (1991), 1-0, 2-0 and 3-0, J'' ≤ 30", () => {
    const full = shippedDiatomic("co", "12C16O");
    const cut = truncated(full, (c) => handbookTerms.has(`${c.k}${c.l}`));
    for (const vUpper of [1, 2, 3]) {
      const band = { vUpper, vLower: 0 };
      const truth = bandLines(full, band, { temperatureK: 296, minRelative: 0 }).lines;
      const model = bandLines(cut, band, { temperatureK: 296, minRelative: 0 }).lines;
      const misses: Miss[] = [];
      for (const line of model) {
        if (line.jLower > 30) continue;
        const t = truth.find((l) => l.label === line.label)!;
        misses.push({ label: line.label, missCm: t.wavenumber - line.wavenumber, sigmaCm: line.wavenumberUncertainty });
      }
      const { covered, medianRatio } = coverage(misses);
      expect(covered).toBeGreaterThanOrEqual(0.95);
      expect(medianRatio).toBeLessThanOrEqual(5);
    }
  });

  it("H35Cl 1-0 P(1) and R(0): the handbook table's ± covers the measured positions (2865.098 and 2906.246 cm⁻¹, from memory, ± 0.005)", () => {
    const hcl = shippedDiatomic("hcl", "1H35Cl");
    const lines = bandLines(hcl, { vUpper: 1, vLower: 0 }, { temperatureK: 296 }).lines;
    for (const [label, measuredCm] of [
      ["P(1)", 2865.098],
      ["R(0)", 2906.246],
    ] as const) {
      const line = lines.find((l) => l.label === label)!;
      const miss = Math.abs(measuredCm - line.wavenumber);
      expect(miss).toBeLessThanOrEqual(line.wavenumberUncertainty + 0.005);
      expect(line.wavenumberUncertainty).toBeLessThanOrEqual(5 * miss);
    }
  });
});
