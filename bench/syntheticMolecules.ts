import { mkdirSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { shippedMoleculesDir } from "../lib/cli/moleculeSource.ts";

// Real atoms (so the isotope masses come from the reference library as for any file) in invented
// pairs; every constant below is invented for load testing and belongs to no real molecule.
const pairs: Array<{ atoms: [string, string]; massNumbers: [number, number] }> = [
  { atoms: ["H", "F"], massNumbers: [1, 19] },
  { atoms: ["H", "Cl"], massNumbers: [1, 35] },
  { atoms: ["C", "O"], massNumbers: [12, 16] },
  { atoms: ["N", "O"], massNumbers: [14, 16] },
  { atoms: ["H", "Br"], massNumbers: [1, 79] },
  { atoms: ["C", "S"], massNumbers: [12, 32] },
];

/** A small deterministic generator, so the same N gives the same files on every run. */
function random(seed: number) {
  let s = seed >>> 0;
  return () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
}

/** An invented CAS-shaped number with a valid check digit (the loader checks it), unique per i. */
function inventedCasNumber(i: number): string {
  const digits = `${9000000 + i}`;
  const check = [...digits].reverse().reduce((sum, d, k) => sum + Number(d) * (k + 1), 0) % 10;
  return `${digits.slice(0, -2)}-${digits.slice(-2)}-${check}`;
}

/** The text of synthetic molecule file number i: invented constants, labelled as invented. */
export function syntheticMoleculeText(i: number): string {
  const r = random(i + 1);
  const pair = pairs[i % pairs.length];
  const id = `synthetic-${String(i).padStart(4, "0")}`;
  // Invented, but in the range of real light diatomics so the bands look like real ones.
  const omegaE = 1400 + 2600 * r();
  const omegaExe = omegaE * (0.004 + 0.018 * r());
  const bE = 1.5 + 9 * r();
  const alphaE = bE * (0.008 + 0.03 * r());
  const dE = (4 * bE ** 3) / omegaE ** 2;
  return `# INVENTED MOLECULE for bandatlas's scale benchmark (bench/syntheticMolecules.ts).
# Every constant in this file is invented; it describes no real gas. Never copy it into molecules/.
id: ${id}
name: Invented test gas ${i}
formula: ${pair.atoms.join("")}
casNumber: "${inventedCasNumber(i)}"   # invented
aliases: ["invented benchmark molecule ${i}"]
electronicState: "X 1Σ+"
atoms: [${pair.atoms.join(", ")}]
hazard:
  # invented for the benchmark; a real file states the gas's own classification
  ghsPictograms: [GHS04]
  sentences:
    - "Invented test gas: treat as a compressed gas of unknown toxicity."
sources:
  invented:
    citation: "Invented constants for the bandatlas scale benchmark; not a real source."
species:
  - massNumbers: [${pair.massNumbers.join(", ")}]
    reference: true
    constants:
      source: invented
      equilibrium:
        omegaE: ${omegaE.toFixed(3)}     # invented
        omegaExe: ${omegaExe.toFixed(4)}     # invented
        bE: ${bE.toFixed(5)}     # invented
        alphaE: ${alphaE.toFixed(6)}     # invented
        dE: ${dE.toExponential(4)}     # invented (Kratzer-like, 4Be³/ωe²)
`;
}

/** Writes N invented molecule files into dir (a temporary folder, never molecules/). */
export function writeSyntheticMolecules(dir: string, n: number): string {
  if (resolve(dir).startsWith(resolve(shippedMoleculesDir))) throw new Error("synthetic molecules never go into molecules/");
  mkdirSync(dir, { recursive: true });
  for (let i = 0; i < n; i++) writeFileSync(join(dir, `synthetic-${String(i).padStart(4, "0")}.yaml`), syntheticMoleculeText(i));
  return dir;
}
