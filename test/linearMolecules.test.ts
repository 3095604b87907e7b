import { describe, expect, it } from "vitest";
import {
  bandLines,
  harmonicVibrationalPartitionFunction,
  linearRotationalPartitionFunction,
  nuclearSpinWeight,
  rigidRotorPartitionFunctionExpansion,
  speciesPartitionFunction,
  vibrationalPartitionFunction,
  type LinearSpeciesData,
  type LinearSpeciesModel,
} from "../lib/core/index.ts";
import { atlasEntry, findInAtlas, resolveBand, selectMolecule, selectSpecies } from "../lib/atlas/index.ts";
import { formatProblem, parseMoleculeText } from "../lib/molecules/index.ts";
import { linearModel, shippedMolecules, shippedSpecies } from "./helpers/shipped.ts";

const co2 = () => linearModel(shippedSpecies("co2"));
const n2o = () => linearModel(shippedSpecies("n2o"));

/** A linear species with the given states, invented for these tests (numbers of the size of 12C2H2's, not its constants). */
function inventedSpecies(weights: LinearSpeciesData["nuclearSpinWeights"], symmetries: ["Σ+" | "Σg+" | "Σu+", "Σ+" | "Σg+" | "Σu+"]): LinearSpeciesModel {
  const c = (valueCm: number) => ({ valueCm, uncertaintyCm: 0 });
  const linear: LinearSpeciesData = {
    states: [
      { id: "g", symmetry: symmetries[0], termEnergy: c(0), b: c(1.18), d: c(1.6e-6), h: c(0), sourceKey: "invented" },
      { id: "u", symmetry: symmetries[1], termEnergy: c(6556), b: c(1.17), d: c(1.6e-6), h: c(0), sourceKey: "invented" },
    ],
    bands: [
      {
        band: { label: "u-g", upperStateIndex: 1, lowerStateIndex: 0 },
        upperStateIndex: 1,
        lowerStateIndex: 0,
        name: "invented",
        kind: "combination",
        sourceKey: "invented",
      },
    ],
    groundStateIndex: 0,
    modes: [
      { wavenumberCm: 3374, degeneracy: 1 },
      { wavenumberCm: 1974, degeneracy: 1 },
      { wavenumberCm: 3289, degeneracy: 1 },
      { wavenumberCm: 612, degeneracy: 2 },
      { wavenumberCm: 730, degeneracy: 2 },
    ],
    nuclearSpinWeights: weights,
  };
  return {
    structure: "linear",
    label: "invented",
    massNumbers: [],
    atomMassesU: [],
    abundance: 1,
    constantsOrigin: "cited",
    constantsSourceKey: "invented",
    intensities: [],
    referenceLines: [],
    linear,
  };
}

describe("vibrational partition function", () => {
  it("the direct level sum equals the harmonic closed form Π(1 − e^(−c2ω/T))^(−d)", () => {
    // Closed form: Herzberg, Infrared and Raman Spectra (1945), ch. V; McQuarrie, Statistical Mechanics (1976), ch. 8.
    // The sum over C(v+d−1, v)-fold levels must reproduce it to rounding (1e-12 relative).
    for (const species of [co2(), n2o()]) {
      for (const temperatureK of [200, 296, 1000, 3000]) {
        const direct = vibrationalPartitionFunction(species.linear.modes, temperatureK);
        const closed = harmonicVibrationalPartitionFunction(species.linear.modes, temperatureK);
        expect(Math.abs(direct / closed - 1), `${species.label} ${temperatureK} K`).toBeLessThan(1e-12);
      }
    }
  });
  it("counts a doubly degenerate bend twice: its factor is the square of a single mode's", () => {
    // Fact of the trade (common practice, no source): a d-fold mode contributes (1 − e^(−x))^(−d).
    const single = harmonicVibrationalPartitionFunction([{ wavenumberCm: 667.379, degeneracy: 1 }], 296);
    const bend = vibrationalPartitionFunction([{ wavenumberCm: 667.379, degeneracy: 2 }], 296);
    expect(Math.abs(bend / (single * single) - 1)).toBeLessThan(1e-12);
    // 12C16O2 at 296 K: the bend dominates; Q_vib ≈ 1.0841 from the closed form with the cited
    // fundamentals (1388.1847, 667.379 ×2, 2349.1433), computed by hand here as a check of the wiring.
    const x = (w: number) => 1 / (1 - Math.exp((-1.438776877 * w) / 296));
    expect(vibrationalPartitionFunction(co2().linear.modes, 296)).toBeCloseTo(x(1388.1847) * x(667.379) ** 2 * x(2349.1433), 9);
  });
});

describe("rotational partition function of a linear molecule", () => {
  it("12C16O2 (only even J exist) gives half of Mulholland's rigid-rotor sum: symmetry number 2", () => {
    // Mulholland, Proc. Cambridge Philos. Soc. 24, 280 (1928); σ = 2 for D∞h (Herzberg 1945, ch. V).
    // Summing only even J gives ½(kT/hcB) + 1/6 + …; centrifugal distortion adds ≈ 4·10⁻⁴ at 296 K, so 1e-3 relative.
    const q = linearRotationalPartitionFunction(co2().linear, 296);
    const mulholland = rigidRotorPartitionFunctionExpansion(0.39021894, 296);
    expect(Math.abs(q / (0.5 * mulholland) - 1)).toBeLessThan(1e-3);
  });
  it("weights 1 and 3 of a 12C2H2-like ground state double the unweighted sum (average weight 2)", () => {
    // Fact of the trade (Herzberg 1945, ch. I): Σ_J g_J (2J+1) e^(…) with g = 1, 3 alternating ≈ 2 × the plain sum at kT ≫ hcB.
    const weighted = linearRotationalPartitionFunction(inventedSpecies({ evenJ: 1, oddJ: 3 }, ["Σg+", "Σu+"]).linear, 296);
    const plain = linearRotationalPartitionFunction(inventedSpecies(null, ["Σ+", "Σ+"]).linear, 296);
    expect(Math.abs(weighted / (2 * plain) - 1)).toBeLessThan(1e-3);
  });
  it("12C16O2 and 14N2 16O total Q(296 K) lie near the values in the literature", () => {
    // From memory: Q(296 K) ≈ 286.1 for 12C16O2 and ≈ 4984 for 14N2 16O counting the 14N spin
    // degeneracy 9 (≈ 553.8 without it), e.g. in the partition-sum compilations of Fischer, Gamache et al. (2003).
    // The product Q_vib·Q_rot neglects rotation–vibration coupling: 0.5 % tolerance.
    expect(Math.abs(speciesPartitionFunction(co2(), 296) / 286.1 - 1)).toBeLessThan(5e-3);
    expect(Math.abs(speciesPartitionFunction(n2o(), 296) / (4984 / 9) - 1)).toBeLessThan(5e-3);
  });
});

describe("nuclear-spin statistics", () => {
  it("12C2H2-like Σu+ ← Σg+ band: lines from odd J'' are 3 times as strong as the smooth envelope, even J'' once", () => {
    // Fact of the trade (Herzberg 1945, ch. I.3): H has spin ½, so in 12C2H2 ortho (odd J of Σg+) : para = 3 : 1.
    const weighted = bandLines(
      inventedSpecies({ evenJ: 1, oddJ: 3 }, ["Σg+", "Σu+"]),
      { label: "u-g", upperStateIndex: 1, lowerStateIndex: 0 },
      { temperatureK: 296, minRelative: 0 },
    );
    const plain = bandLines(
      inventedSpecies(null, ["Σ+", "Σ+"]),
      { label: "u-g", upperStateIndex: 1, lowerStateIndex: 0 },
      { temperatureK: 296, minRelative: 0 },
    );
    const ratio = (label: string) =>
      weighted.lines.find((l) => l.label === label)!.relativeIntensity / plain.lines.find((l) => l.label === label)!.relativeIntensity;
    for (const j of [1, 3, 5, 9, 15]) {
      expect(ratio(`R(${j})`) / ratio(`R(${j - 1})`), `R(${j})/R(${j - 1})`).toBeCloseTo(3, 10);
      expect(ratio(`P(${j})`) / ratio(`P(${j + 1})`), `P(${j})/P(${j + 1})`).toBeCloseTo(3, 10);
    }
  });
  it("the weight rule swaps for a Σu+ state and is absent without a centre of symmetry", () => {
    // Herzberg 1945, ch. I.3: even J of Σg+ and odd J of Σu+ are symmetric in the nuclei.
    expect([0, 1, 2, 3].map((j) => nuclearSpinWeight({ evenJ: 1, oddJ: 0 }, "Σg+", j))).toEqual([1, 0, 1, 0]);
    expect([0, 1, 2, 3].map((j) => nuclearSpinWeight({ evenJ: 1, oddJ: 0 }, "Σu+", j))).toEqual([0, 1, 0, 1]);
    expect([0, 1, 2, 3].map((j) => nuclearSpinWeight(null, "Σ+", j))).toEqual([1, 1, 1, 1]);
  });
  it("12C16O2 ν3 has every other line missing: only even J'' (R(0), R(2), P(2) …), never P(1) or R(1)", () => {
    // Fact of the trade: 16O has nuclear spin 0, so the ground state 00001 has only even J (Herzberg 1945).
    const result = bandLines(
      co2(),
      resolveBand(selectMolecule(shippedMolecules(), "co2"), selectSpecies(selectMolecule(shippedMolecules(), "co2"), undefined), undefined),
      { temperatureK: 296, minRelative: 0 },
    );
    expect(result.lines.length).toBeGreaterThan(100);
    expect(result.lines.every((l) => l.jLower % 2 === 0)).toBe(true);
    const labels = new Set(result.lines.map((l) => l.label));
    for (const present of ["R(0)", "R(2)", "P(2)", "P(4)"]) expect(labels.has(present), present).toBe(true);
    for (const absent of ["R(1)", "P(1)", "P(3)", "R(3)"]) expect(labels.has(absent), absent).toBe(false);
    // The gap between neighbouring R lines is about 4B (≈ 1.53 cm⁻¹), twice the diatomic spacing (fact of the trade).
    const r = (j: number) => result.lines.find((l) => l.label === `R(${j})`)!.wavenumber;
    expect(r(2) - r(0)).toBeGreaterThan(1.5);
    expect(r(2) - r(0)).toBeLessThan(1.56);
  });
  it("14N2 16O ν3 (no centre of symmetry) has every J'' and no alternation", () => {
    // Fact of the trade (common practice, no source): unsymmetric linear molecules (HCN, N2O, OCS) show no alternation.
    const result = bandLines(n2o(), n2o().linear.bands[0].band, { temperatureK: 296, minRelative: 0 });
    const r = (j: number) => result.lines.find((l) => l.label === `R(${j})`)!;
    for (const j of [0, 1, 2, 3, 4]) expect(r(j), `R(${j})`).toBeDefined();
    // Without alternation the envelope is smooth: each R(J) lies between its neighbours or at the maximum.
    for (let j = 1; j < 40; j++) {
      const [a, b, c] = [r(j - 1).relativeIntensity, r(j).relativeIntensity, r(j + 1).relativeIntensity];
      expect(b >= Math.min(a, c), `R(${j})`).toBe(true);
    }
  });
});

describe("line positions from the cited state constants", () => {
  it("12C16O2 ν3 band origin and low-J lines follow the textbook P/R formula with Rothman & Young's constants", () => {
    // Constants as read for the file (Rothman & Young, JQSRT 25, 505 (1981), public copy): G' = 2349.1433,
    // B'' = 0.39021894, B' = 0.38714140, D'' = 1.33373e-7, D' = 1.33034e-7 (H neglected: under 1e-7 cm⁻¹ at m ≤ 11, hence 5e-7 tolerance).
    // ν(m) = ν0 + (B'+B'')m + (B'−B'')m² − 2(D'+D'')m³ − (D'−D'')m⁴, m = J''+1 (R), −J'' (P): Herzberg 1950, ch. III.
    const [nu0, b1, b0, d1, d0] = [2349.1433, 0.3871414, 0.39021894, 1.33034e-7, 1.33373e-7];
    const textbook = (m: number) => nu0 + (b1 + b0) * m + (b1 - b0) * m * m - 2 * (d1 + d0) * m ** 3 - (d1 - d0) * m ** 4;
    const result = bandLines(co2(), co2().linear.bands[0].band, { temperatureK: 296, minRelative: 0 });
    expect(result.bandOrigin).toBeCloseTo(2349.1433, 6);
    for (const [label, m] of [
      ["R(0)", 1],
      ["R(2)", 3],
      ["R(10)", 11],
      ["P(2)", -2],
      ["P(10)", -10],
    ] as const) {
      expect(result.lines.find((l) => l.label === label)!.wavenumber, label).toBeCloseTo(textbook(m), 6);
    }
  });
  it("12C16O2 ν3 R(0) lies near 4.2555 µm, the familiar 4.3 µm band (fact of the trade)", () => {
    const r0 = bandLines(co2(), co2().linear.bands[0].band, { temperatureK: 296 }).lines.find((l) => l.label === "R(0)")!;
    expect(r0.wavelengthVacuumUm).toBeGreaterThan(4.25);
    expect(r0.wavelengthVacuumUm).toBeLessThan(4.26);
  });
  it("lines come out sorted by wavenumber through an R-branch head (B' < B'' in ν3 of 12C16O2)", () => {
    // The R branch turns back near m ≈ (B'+B'')/2(B''−B') ≈ 127 (Herzberg 1950, ch. III): at 3000 K the list reaches it.
    const result = bandLines(co2(), co2().linear.bands[0].band, { temperatureK: 3000, minRelative: 0 });
    for (let i = 1; i < result.lines.length; i++) expect(result.lines[i].wavenumber).toBeGreaterThanOrEqual(result.lines[i - 1].wavenumber);
    const rBranch = result.lines.filter((l) => l.branch === "R").sort((a, b) => a.jLower - b.jLower);
    const headIndex = rBranch.reduce((best, l, i) => (l.wavenumber > rBranch[best].wavenumber ? i : best), 0);
    expect(rBranch[headIndex].jLower).toBeGreaterThan(110);
    expect(rBranch[headIndex].jLower).toBeLessThan(rBranch.at(-1)!.jLower);
  });
});

describe("atlas and search include the linear molecules", () => {
  it("atlasEntry builds the bands the file lists, first band as the reference", () => {
    const molecule = selectMolecule(shippedMolecules(), "co2");
    const entry = atlasEntry(molecule, molecule.species[0], 296);
    expect(entry.bands.map((b) => [b.label, b.name, b.kind])).toEqual([["00011-00001", "ν3", "fundamental"]]);
    expect(entry.bands[0].shownWithFundamental).toBe(true);
    expect(entry.partitionFunction).toBeCloseTo(speciesPartitionFunction(molecule.species[0].model, 296), 10);
  });
  it("find locates 12C16O2 R(0) and 14N2 16O ν3 lines by wavenumber", () => {
    const near = findInAtlas(shippedMolecules(), 2349.92, 0.05, 296, 1e-3);
    expect(near.some((m) => m.molecule === "co2" && m.label === "R(0)")).toBe(true);
    const n2oNear = findInAtlas(shippedMolecules(), 2224.6, 1, 296, 1e-3);
    expect(n2oNear.some((m) => m.molecule === "n2o" && m.band === "0001-0000")).toBe(true);
  });
});

describe("linear-molecule files are validated with file:line:column", () => {
  const base = (states: string, bands: string, extra = "") => `structure: linear
id: test
name: Test
formula: CO2
casNumber: "124-38-9"
electronicState: "X 1Σg+"
atoms: [O, C, O]
hazard: { ghsPictograms: [GHS04], sentences: ["Invented test file."] }
sources: { s: { citation: "invented for a test" } }
species:
  - massNumbers: [16, 12, 16]
    reference: true
    nuclearSpinWeights: { evenJ: 1, oddJ: 0, source: s }
    vibrationalModes: { source: s, modes: [{ wavenumber: 1388, degeneracy: 1 }, { wavenumber: 667, degeneracy: 2 }, { wavenumber: 2349, degeneracy: 1 }${extra}] }
    states:
${states}
    bands:
${bands}
`;
  const ground = `      - { id: "00001", symmetry: "Σg+", source: s, termEnergy: 0, b: 0.39 }`;
  const problemsOf = (text: string) => {
    const result = parseMoleculeText(text, "test.yaml", "test");
    return result.ok ? [] : result.problems.map(formatProblem);
  };
  it("accepts a good file", () => {
    expect(
      problemsOf(
        base(
          `${ground}\n      - { id: "00011", symmetry: "Σu+", source: s, termEnergy: 2349.1, b: 0.387 }`,
          `      - { upper: "00011", lower: "00001", name: "ν3", kind: fundamental, source: s, bandOrigin: 2349.1 }`,
        ),
      ),
    ).toEqual([]);
  });
  it("refuses a Π state (a perpendicular band) with a message saying what is modelled", () => {
    const problems = problemsOf(
      base(
        `${ground}\n      - { id: "01101", symmetry: "Πu", source: s, termEnergy: 667.4, b: 0.39 }`,
        `      - { upper: "01101", lower: "00001", name: "ν2", kind: fundamental, source: s }`,
      ),
    );
    expect(problems.join("\n")).toMatch(/^test\.yaml:17:\d+: `species\[0\]\.states\[1\]\.symmetry`: .*Π.*not modelled.*Σ–Σ/m);
  });
  it("refuses a g ← g band and a band origin that disagrees with the term energies", () => {
    const problems = problemsOf(
      base(
        `${ground}\n      - { id: "10001", symmetry: "Σg+", source: s, termEnergy: 1388.2, b: 0.39 }`,
        `      - { upper: "10001", lower: "00001", name: "ν1", kind: fundamental, source: s, bandOrigin: 1390.5 }`,
      ),
    ).join("\n");
    expect(problems).toMatch(/test\.yaml:19:\d+: .*forbidden for an electric-dipole transition/);
    expect(problems).toMatch(/bandOrigin.*disagrees with the states. term energies/);
  });
  it("refuses modes that do not add up to 3N−5", () => {
    const problems = problemsOf(
      base(
        `${ground}\n      - { id: "00011", symmetry: "Σu+", source: s, termEnergy: 2349.1, b: 0.387 }`,
        `      - { upper: "00011", lower: "00001", name: "ν3", kind: fundamental, source: s }`,
        `, { wavenumber: 100, degeneracy: 1 }`,
      ),
    ).join("\n");
    expect(problems).toMatch(/3N−5 = 4/);
  });
  it("refuses an unknown structure", () => {
    expect(problemsOf("structure: ring\nid: x\n").join("\n")).toMatch(/^test\.yaml:1:1: `structure`: structure "ring" is not known/);
  });
});
