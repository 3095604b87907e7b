import { isMap, isPair, isScalar, LineCounter, parseDocument, type Document } from "yaml";
import { CoreInputError } from "../core/index.ts";
import { buildMolecule } from "./buildMolecule.ts";
import { fitResultProblems, referenceSpeciesIndex, runFileFit, type FileFit } from "./fileFit.ts";
import { diatomicProblems } from "./diatomicChecks.ts";
import { identityProblems } from "./identityChecks.ts";
import { formatPath, sortProblems, withFileChecks, type Problem } from "./problems.ts";
import type { z } from "zod";
import { diatomicFileSchema, type DiatomicMoleculeFile, type IdentityFields } from "./schema.ts";
import { linearMoleculeFileSchema } from "./linearSchema.ts";
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
  // Placeholders and identity (id, CAS, elements, links) are checked on every field that passes its
  // own schema, even when others fail, so one run of \`check\` lists every problem it can see.
  const fields = validFields(structure === "linear" ? linearMoleculeFileSchema : diatomicFileSchema, raw);
  const fileChecks = [...placeholderProblems(raw, []), ...identityProblems(fields, expectedId)];
  if (structure === "linear") return parseLinearMolecule(raw, file, expectedId, located, options, fileChecks);
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
    // The diatomic checks (states, isotopes, bands, sources of constants) need only some fields:
    // when those passed the schema, they run too.
    const given = raw as Record<string, unknown>;
    const ready = diatomicCheckFields.every((key) => key in fields || (optionalForDiatomicChecks.includes(key) && given[key] === undefined));
    const semantic = ready ? diatomicProblems(fields as DiatomicMoleculeFile) : [];
    return { ok: false, problems: withFileChecks(problems, [...fileChecks, ...semantic], located) };
  }
  for (const { path, message } of [...fileChecks, ...diatomicProblems(parsed.data)]) problems.push(located(path, message));
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

/** The fields diatomicProblems reads; the last two may be left out of a file. */
const diatomicCheckFields = ["electronicState", "atoms", "species", "sources", "intensity", "referenceLines"];
const optionalForDiatomicChecks = ["intensity", "referenceLines"];

/**
 * The top-level fields of a file that pass their own part of the schema, parsed, so the checks
 * beyond the schema can run on them while other fields are wrong (they skip what is missing).
 */
function validFields(schema: typeof diatomicFileSchema | typeof linearMoleculeFileSchema, raw: unknown): Partial<IdentityFields> {
  const out: Record<string, unknown> = {};
  const fields = raw as Record<string, unknown>;
  for (const [key, part] of Object.entries(schema.shape as Record<string, z.ZodType>)) {
    const result = part.safeParse(fields[key]);
    if (result.success && result.data !== undefined) out[key] = result.data;
  }
  return out as Partial<IdentityFields>;
}
