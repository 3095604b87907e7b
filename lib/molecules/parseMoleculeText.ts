import { isMap, isPair, isScalar, LineCounter, parseDocument, type Document } from "yaml";
import { parseBand, CoreInputError } from "../core/index.ts";
import { buildMolecule } from "./buildMolecule.ts";
import { fitResultProblems, referenceSpeciesIndex, runFileFit, type FileFit } from "./fileFit.ts";
import { identityProblems, sourceChecker, type Found } from "./identityChecks.ts";
import { isKnownElement, isotope, stableMassNumbers } from "./isotopes.ts";
import { formatPath, type Problem } from "./problems.ts";
import { diatomicFileSchema, type DiatomicMoleculeFile } from "./schema.ts";
import { parseLinearMolecule } from "./parseLinearMolecule.ts";
import type { ParseOptions, ParseResult } from "./parseResult.ts";

/** Files larger than this are refused before parsing: a molecule file is a few kilobytes. */
export const maxMoleculeFileBytes = 256 * 1024;
/** YAML aliases allowed in one file; a handful is plenty, thousands is an expansion attack. */
export const maxYamlAliases = 20;

type Path = ReadonlyArray<string | number>;

function locate(doc: Document, counter: LineCounter, path: Path): { line: number; column: number } | null {
  // Walk down as far as the path exists; point at the key where there is one.
  let node: unknown = doc.contents;
  let offset: number | null = (doc.contents as { range?: [number, number] } | null)?.range?.[0] ?? null;
  for (const part of path) {
    if (isMap(node)) {
      const pair = node.items.find((p) => isPair(p) && isScalar(p.key) && p.key.value === part);
      if (!pair) break;
      offset = (pair.key as { range?: [number, number] }).range?.[0] ?? offset;
      node = pair.value;
    } else if (node && typeof node === "object" && "items" in node && typeof part === "number") {
      const item = (node as { items: unknown[] }).items[part];
      if (!item) break;
      offset = (item as { range?: [number, number] }).range?.[0] ?? offset;
      node = item;
    } else break;
  }
  if (offset === null) return null;
  const pos = counter.linePos(offset);
  return { line: pos.line, column: pos.col };
}

function decode(bytes: Uint8Array, file: string): { text: string } | { problem: Problem } {
  const whole = (message: string): { problem: Problem } => ({ problem: { file, line: null, column: null, path: "", message } });
  if (bytes.byteLength > maxMoleculeFileBytes) {
    return whole(`the file is ${bytes.byteLength} bytes; molecule files are limited to ${maxMoleculeFileBytes} bytes (${maxMoleculeFileBytes / 1024} KiB)`);
  }
  try {
    const text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
    return { text: text.replace(/^\uFEFF/, "") };
  } catch {
    return whole("the file is not valid UTF-8 text; save it as UTF-8 (most editors offer this under 'Save with encoding')");
  }
}

export const modelledStates = /^(?:X\s*)?(?:1|¹)\s*(?:Σ|Sigma)\s*(?:\+|⁺)$/i;

function cmPerNumber(value: unknown): number | null {
  if (typeof value === "number") return value;
  if (value && typeof value === "object" && "value" in value) return (value as { value: number }).value;
  return null;
}

/** Checks of a diatomic file no schema can express: references between fields, physics sanity. */
export function diatomicProblems(file: DiatomicMoleculeFile): Found[] {
  const out: Found[] = [];
  const add = (path: Path, message: string) => out.push({ path, message });
  const checkSource = sourceChecker(file, add);

  if (!modelledStates.test(file.electronicState.trim())) {
    add(
      ["electronicState"],
      `electronic state "${file.electronicState}" is not modelled: only ¹Σ⁺ states (written "X 1Σ+") are; other states need spin and Λ-doubling terms and a Q branch that the model does not have yet`,
    );
  }
  if (file.atoms.length !== 2) add(["atoms"], `expected 2 atoms for a diatomic molecule, got ${file.atoms.length}`);
  const speciesKeys = new Set<string>();
  const checkMassNumbers = (path: Path, numbers: number[]) => {
    if (numbers.length !== file.atoms.length) {
      add(path, `expected ${file.atoms.length} mass numbers (one per atom: ${file.atoms.join(", ")}), got ${numbers.length}`);
      return false;
    }
    let ok = true;
    numbers.forEach((a, i) => {
      const symbol = file.atoms[i];
      if (!isKnownElement(symbol)) return;
      const found = isotope(symbol, a);
      if (!found) {
        add(
          [...path, i],
          `${a}${symbol} is not a known isotope (stable ones: ${stableMassNumbers(symbol)
            .map((n) => `${n}${symbol}`)
            .join(", ")})`,
        );
        ok = false;
      } else if (found.abundance === null) {
        add([...path, i], `${a}${symbol} has no natural abundance in the isotope library (it is not a stable isotope); only stable isotopes are modelled`);
        ok = false;
      }
    });
    return ok;
  };
  const references = file.species.filter((s) => s.reference === true).length;
  if (references !== 1) add(["species"], `exactly one species must have \`reference: true\`, found ${references}`);
  file.species.forEach((s, i) => {
    const path = ["species", i];
    if (checkMassNumbers([...path, "massNumbers"], s.massNumbers)) {
      const key = s.massNumbers.join(",");
      if (speciesKeys.has(key)) add([...path, "massNumbers"], `species ${s.massNumbers.join("/")} is listed twice`);
      speciesKeys.add(key);
    }
    if (s.reference === true && !s.constants) add([...path], "the reference species needs a `constants` block (the others can be scaled from it)");
    if (!s.constants) return;
    const c = s.constants;
    checkSource([...path, "constants", "source"], c.source);
    const forms = [c.equilibrium, c.dunham, c.massIndependent, c.fit].filter((f) => f !== undefined).length;
    if (forms !== 1) {
      add(
        [...path, "constants"],
        "give exactly one of `equilibrium` (ωe, ωexe, Be, …), `dunham` (Y10, Y01, …), `massIndependent` (U10, U01, …) or `fit` (constants fitted to the file's measured lines)",
      );
      return;
    }
    if (c.crossCheck) {
      checkSource([...path, "constants", "crossCheck", "source"], c.crossCheck.source);
      const crossForms = [c.crossCheck.dunham, c.crossCheck.massIndependent].filter((f) => f !== undefined).length;
      if (crossForms !== 1) add([...path, "constants", "crossCheck"], "a cross-check set gives exactly one of `dunham` or `massIndependent`");
    }
    if (c.massIndependent) {
      for (const atom of Object.keys(c.massIndependent.breakdown ?? {})) {
        if (!file.atoms.includes(atom))
          add([...path, "constants", "massIndependent", "breakdown", atom], `atom ${atom} is not among this molecule's atoms (${file.atoms.join(", ")})`);
      }
    }
    if (c.fit) {
      if (s.reference !== true)
        add(
          [...path, "constants", "fit"],
          "only the reference species carries a fit; the fit takes the measured lines of every species and the others follow from it by the isotope relations",
        );
      const groups = new Set((file.referenceLines ?? []).map((g) => g.source));
      (file.referenceLines ?? []).forEach((group, g) => {
        if (!c.fit!.lines.includes(group.source)) return;
        group.lines.forEach((line, j) => {
          if (line.uncertainty === undefined || line.uncertainty === 0)
            add(["referenceLines", g, "lines", j, "uncertainty"], "a line that enters the fit needs its measured uncertainty (above 0 cm⁻¹) to be weighted");
        });
      });
      c.fit.lines.forEach((key, j) => {
        if (!groups.has(key))
          add([...path, "constants", "fit", "lines", j], `no \`referenceLines\` group has source "${key}" (groups: ${[...groups].join(", ") || "none"})`);
      });
      c.fit.terms.forEach((name, j) => {
        if (c.fit!.terms.indexOf(name) !== j) add([...path, "constants", "fit", "terms", j], `${name} is listed twice`);
        if (name === "Y00") add([...path, "constants", "fit", "terms", j], "Y00 shifts every level alike and cannot be fitted to line positions");
      });
      for (const [atom, names] of Object.entries(c.fit.massCorrections ?? {})) {
        if (!file.atoms.includes(atom))
          add([...path, "constants", "fit", "massCorrections", atom], `atom ${atom} is not among this molecule's atoms (${file.atoms.join(", ")})`);
        names.forEach((name, j) => {
          if (!c.fit!.terms.includes(name))
            add([...path, "constants", "fit", "massCorrections", atom, j], `${name} has a mass correction but is not among the fitted terms`);
        });
      }
      return;
    }
    if (c.equilibrium) {
      const e = c.equilibrium;
      const we = cmPerNumber(e.omegaE)!;
      const be = cmPerNumber(e.bE)!;
      if (!(we > 0)) add([...path, "constants", "equilibrium", "omegaE"], `ωe must be above 0 cm⁻¹, got ${we}`);
      if (!(be > 0)) add([...path, "constants", "equilibrium", "bE"], `Be (rotational constant) must be above 0 cm⁻¹, got ${be}`);
      const wexe = e.omegaExe === undefined ? null : cmPerNumber(e.omegaExe)!;
      // ωexe/ωe is below 0.03 for every known diatomic (H2 ≈ 0.028); a much larger ratio is a typo or a unit slip.
      if (wexe !== null && we > 0 && (wexe < 0 || wexe > 0.1 * we)) {
        add(
          [...path, "constants", "equilibrium", "omegaExe"],
          `ωexe = ${wexe} cm⁻¹ does not make sense for ωe = ${we} cm⁻¹ (expected 0 ≤ ωexe ≤ 0.1·ωe; real molecules have under 0.03·ωe)`,
        );
      }
      const de = e.dE === undefined ? null : cmPerNumber(e.dE)!;
      if (de !== null && be > 0 && (de < 0 || de > 1e-2 * be))
        add([...path, "constants", "equilibrium", "dE"], `De = ${de} cm⁻¹ does not make sense for Be = ${be} cm⁻¹ (expected 0 ≤ De ≤ 0.01·Be)`);
    } else if (c.dunham) {
      const d = c.dunham;
      const y10 = d.Y10 === undefined ? null : cmPerNumber(d.Y10);
      const y01 = d.Y01 === undefined ? null : cmPerNumber(d.Y01);
      if (y10 === null || !(y10 > 0)) add([...path, "constants", "dunham", "Y10"], `Y10 (≈ ωe) is required and must be above 0 cm⁻¹`);
      if (y01 === null || !(y01 > 0)) add([...path, "constants", "dunham", "Y01"], `Y01 (≈ Be, the rotational constant) is required and must be above 0 cm⁻¹`);
      const y20 = d.Y20 === undefined ? null : cmPerNumber(d.Y20);
      if (y10 !== null && y10 > 0 && y20 !== null && (y20 > 0 || -y20 > 0.1 * y10)) {
        add([...path, "constants", "dunham", "Y20"], `Y20 = ${y20} cm⁻¹ (−ωexe) does not make sense for Y10 = ${y10} cm⁻¹ (expected −0.1·Y10 ≤ Y20 ≤ 0)`);
      }
    }
  });
  const checkBand = (path: Path, text: string) => {
    try {
      parseBand(text);
    } catch (error) {
      if (error instanceof CoreInputError) add(path, error.message);
      else throw error;
    }
  };
  const checkSpeciesRef = (path: Path, numbers: number[]) => {
    if (!speciesKeys.has(numbers.join(","))) add(path, `species ${numbers.join("/")} is not among the \`species\` of this file`);
  };
  (file.intensity ?? []).forEach((entry, i) => {
    const path = ["intensity", i];
    checkSource([...path, "source"], entry.source);
    checkSpeciesRef([...path, "massNumbers"], entry.massNumbers);
    checkBand([...path, "band"], entry.band);
    if ((entry.transitionDipoleDebye === undefined) === (entry.bandStrength === undefined)) {
      add(path, "give either `transitionDipoleDebye` or `bandStrength`, exactly one of them");
    }
    if (entry.transitionDipoleDebye !== undefined && !(cmPerNumber(entry.transitionDipoleDebye)! > 0))
      add([...path, "transitionDipoleDebye"], "a transition dipole must be above 0 debye");
    if (entry.bandStrength) {
      if (!(cmPerNumber(entry.bandStrength.cmPerMolecule)! > 0)) add([...path, "bandStrength", "cmPerMolecule"], "a band strength must be above 0 cm/molecule");
      if (!(entry.bandStrength.temperatureK > 0)) add([...path, "bandStrength", "temperatureK"], "the band strength's temperature must be above 0 K");
    }
  });
  (file.referenceLines ?? []).forEach((group, i) => {
    const path = ["referenceLines", i];
    checkSource([...path, "source"], group.source);
    checkSpeciesRef([...path, "massNumbers"], group.massNumbers);
    const [vUpper, vLower] = group.band.split("-").map(Number);
    // Measured lines may be pure rotation (v' = v'', e.g. "0-0"), which fix the rotational constants.
    if (vUpper < vLower) add([...path, "band"], `band "${group.band}": the upper level v' must not be below the lower level v''`);
    group.lines.forEach((line, j) => {
      if (!(line.wavenumber > 0)) add([...path, "lines", j, "wavenumber"], "a line position must be above 0 cm⁻¹");
      if (vUpper === vLower && line.label.startsWith("P")) add([...path, "lines", j, "label"], "a pure-rotation line is written R(J'') for J''+1 ← J''");
    });
  });
  return out;
}

/**
 * Validates one molecule file's bytes. `file` is the path shown in messages; `expectedId` is the
 * file's base name (null to skip the name check, e.g. for text piped in).
 */
export function parseMoleculeBytes(bytes: Uint8Array, file: string, expectedId: string | null, options: ParseOptions = {}): ParseResult {
  const decoded = decode(bytes, file);
  if ("problem" in decoded) return { ok: false, problems: [decoded.problem] };
  return parseMoleculeText(decoded.text, file, expectedId, options);
}

export function parseMoleculeText(text: string, file: string, expectedId: string | null, options: ParseOptions = {}): ParseResult {
  const counter = new LineCounter();
  const doc = parseDocument(text, { lineCounter: counter, uniqueKeys: true, prettyErrors: true, version: "1.2", strict: true });
  const problems: Problem[] = [];
  for (const error of [...doc.errors, ...doc.warnings]) {
    const pos = error.linePos?.[0];
    const first = error.message.split("\n")[0].replace(/ at line \d+, column \d+.*$/, "");
    const message = error.code === "DUPLICATE_KEY" ? `a key appears twice in the same mapping (${first})` : `YAML syntax: ${first}`;
    problems.push({ file, line: pos?.line ?? null, column: pos?.col ?? null, path: "", message });
  }
  if (problems.length) return { ok: false, problems };
  if (!isMap(doc.contents)) {
    const pos = doc.contents?.range ? counter.linePos(doc.contents.range[0]) : null;
    return {
      ok: false,
      problems: [
        {
          file,
          line: pos?.line ?? 1,
          column: pos?.col ?? 1,
          path: "",
          message: "the file must be a mapping of fields (id: …, name: …), not a single value or a list",
        },
      ],
    };
  }
  let raw: unknown;
  try {
    raw = doc.toJS({ maxAliasCount: maxYamlAliases });
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    return {
      ok: false,
      problems: [
        {
          file,
          line: null,
          column: null,
          path: "",
          message: `YAML aliases expand too far (${message}); write the values out, at most ${maxYamlAliases} aliases per file`,
        },
      ],
    };
  }
  const located = (path: Path, message: string): Problem => {
    const pos = locate(doc, counter, path);
    return { file, line: pos?.line ?? null, column: pos?.column ?? null, path: formatPath(path), message };
  };
  const structure = (raw as { structure?: unknown }).structure;
  if (structure === "linear") return parseLinearMolecule(raw, file, expectedId, located, options);
  if (structure !== undefined && structure !== "diatomic")
    return {
      ok: false,
      problems: [
        located(
          ["structure"],
          `structure ${JSON.stringify(structure)} is not known: leave it out (or write diatomic) for a diatomic, write linear for a linear polyatomic molecule`,
        ),
      ],
    };
  const parsed = diatomicFileSchema.safeParse(raw);
  if (!parsed.success) {
    for (const issue of expandUnions(parsed.error.issues, raw)) {
      const path = issue.path as Path;
      if (issue.code === "unrecognized_keys") {
        const messages = issue.message.split("; unknown field ");
        (issue.keys ?? []).forEach((key, i) => problems.push(located([...path, key], i === 0 ? messages[0] : `unknown field ${messages[i]}`)));
      } else problems.push(located(path, issue.message));
    }
    return { ok: false, problems: sortProblems(problems) };
  }
  for (const { path, message } of [...placeholderProblems(raw, []), ...identityProblems(parsed.data, expectedId), ...diatomicProblems(parsed.data)])
    problems.push(located(path, message));
  if (problems.length) return { ok: false, problems: sortProblems(problems) };
  // The build and the check re-run every fit, so a file's constants cannot drift from their lines.
  let fileFit: FileFit | null = null;
  try {
    fileFit = runFileFit(parsed.data);
  } catch (error) {
    if (!(error instanceof CoreInputError)) throw error;
    const index = referenceSpeciesIndex(parsed.data);
    return { ok: false, problems: [located(["species", index, "constants", "fit"], `the fit cannot be made: ${error.message}`)] };
  }
  if (fileFit && options.checkFitResult !== false) {
    for (const { path, message } of fitResultProblems(parsed.data, fileFit)) problems.push(located(path, message));
    if (problems.length) return { ok: false, problems: sortProblems(problems) };
  }
  return { ok: true, molecule: buildMolecule(parsed.data, file, { fileFit }), data: parsed.data, fileFit };
}

type Issue = { code: string; path: PropertyKey[]; message: string; keys?: string[]; errors?: Issue[][] };

function valueAt(root: unknown, path: PropertyKey[]): unknown {
  let node = root;
  for (const part of path) node = node && typeof node === "object" ? (node as Record<PropertyKey, unknown>)[part] : undefined;
  return node;
}

/**
 * A constant may be a number or { value, uncertainty }. When a mapping was given and is wrong
 * inside, report the mapping's own problems ("value: expected a number …"), not the union's summary.
 */
function expandUnions(issues: ReadonlyArray<unknown>, raw: unknown): Issue[] {
  const out: Issue[] = [];
  for (const item of issues as Issue[]) {
    const input = valueAt(raw, item.path);
    if (item.code === "invalid_union" && item.errors && input && typeof input === "object" && !Array.isArray(input)) {
      const branch = item.errors[item.errors.length - 1];
      out.push(
        ...expandUnions(
          branch.map((e) => ({ ...e, path: [...item.path, ...e.path] })),
          raw,
        ),
      );
    } else out.push(item);
  }
  return out;
}

// Control characters and bidirectional overrides can hide text or reorder it on screen (the
// "Trojan Source" trick): refused in every text of a molecule file.
const invisibleCharacters = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F\u200E\u200F\u202A-\u202E\u2066-\u2069]/;

/** Per-text checks: template placeholders left in, and invisible or reordering characters. */
function placeholderProblems(node: unknown, path: Array<string | number>): Array<{ path: Path; message: string }> {
  if (typeof node === "string") {
    if (invisibleCharacters.test(node)) {
      const code = node.match(invisibleCharacters)![0].codePointAt(0)!.toString(16).toUpperCase().padStart(4, "0");
      return [{ path, message: `contains the invisible control character U+${code}; retype the text without it` }];
    }
    return /\bREPLACE\b/.test(node) ? [{ path, message: "still holds the template's placeholder REPLACE; put the real value (and its source) here" }] : [];
  }
  if (Array.isArray(node)) return node.flatMap((item, i) => placeholderProblems(item, [...path, i]));
  if (node && typeof node === "object") return Object.entries(node).flatMap(([key, value]) => placeholderProblems(value, [...path, key]));
  return [];
}

function sortProblems(problems: Problem[]): Problem[] {
  return problems.sort((a, b) => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0));
}
