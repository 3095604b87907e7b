// The folders of lib/ form layers (lib/README.md): each imports only folders below it, so no two
// folders import each other and lib/core stays runnable in the browser without Node. Every import
// form counts, read with TypeScript's own parser: static imports and re-exports (types too), literal
// dynamic import(), import("…") types, and new URL("…", import.meta.url), which is how worker entries
// and bundle entries name their files. A file outside lib/ that lib/ imports (eleventy.config.ts) is
// followed, so an edge cannot hide behind it.
import { readdirSync, readFileSync } from "node:fs";
import { builtinModules } from "node:module";
import { dirname, extname, join, relative, resolve, sep } from "node:path";
import ts from "typescript";
import { describe, expect, it } from "vitest";

const repoDir = resolve(import.meta.dirname, "..");
const libDir = join(repoDir, "lib");

/** Lowest first; a folder may import only folders in an earlier row. */
const layers: string[][] = [
  ["core"], // physics: pure functions over plain data
  ["shared"], // build identity, site paths, ticks, index formats, GHS table, command results
  ["molecules"], // molecule files: schema, parsing, validation
  ["atlas"], // which species, bands, temperatures; AtlasEntry
  ["format"], // numbers, tables, CSV/JSON, notes, bench settings as text
  ["plot", "site", "sheet", "browser"], // renderers: only format what the atlas made
  ["build"], // puts the renderers' output together into site/
  ["cli"], // the command line, on top of everything
];
const renderers = new Set(layers[5]);
/**
 * The packages lib/core may import: plain JavaScript with no Node APIs, so the core still runs in
 * the browser bundle. ml-matrix: the decompositions behind the weighted least-squares fits.
 */
const corePackages = new Set(["ml-matrix"]);
const rankOf = new Map(layers.flatMap((row, rank) => row.map((folder) => [folder, rank] as const)));

const codeExtensions = new Set([".ts", ".mts", ".cts", ".mjs", ".js", ".cjs"]);

interface Reference {
  specifier: string;
  kind: "import" | "export" | "dynamic import" | "import type" | "require" | "new URL";
  line: number;
}

/** Every module a file names, and the places where it names one the check cannot read (a computed path). */
function referencesOf(fileName: string, text: string): { references: Reference[]; unreadable: Reference[] } {
  const source = ts.createSourceFile(fileName, text, ts.ScriptTarget.Latest, true);
  const references: Reference[] = [];
  const unreadable: Reference[] = [];
  const lineOf = (node: ts.Node) => source.getLineAndCharacterOfPosition(node.getStart(source)).line + 1;
  const literal = (node: ts.Node | undefined): string | null =>
    node && (ts.isStringLiteral(node) || ts.isNoSubstitutionTemplateLiteral(node)) ? node.text : null;
  const add = (node: ts.Node, specifierNode: ts.Node | undefined, kind: Reference["kind"]) => {
    const specifier = literal(specifierNode);
    (specifier === null ? unreadable : references).push({ specifier: specifier ?? specifierNode?.getText(source) ?? "", kind, line: lineOf(node) });
  };
  const isImportMetaUrl = (node: ts.Node | undefined) =>
    !!node &&
    ts.isPropertyAccessExpression(node) &&
    node.name.text === "url" &&
    ts.isMetaProperty(node.expression) &&
    node.expression.keywordToken === ts.SyntaxKind.ImportKeyword;
  const visit = (node: ts.Node): void => {
    if (ts.isImportDeclaration(node)) add(node, node.moduleSpecifier, "import");
    else if (ts.isExportDeclaration(node) && node.moduleSpecifier) add(node, node.moduleSpecifier, "export");
    else if (ts.isImportEqualsDeclaration(node) && ts.isExternalModuleReference(node.moduleReference)) add(node, node.moduleReference.expression, "require");
    else if (ts.isImportTypeNode(node) && ts.isLiteralTypeNode(node.argument)) add(node, node.argument.literal, "import type");
    else if (ts.isCallExpression(node) && node.expression.kind === ts.SyntaxKind.ImportKeyword) add(node, node.arguments[0], "dynamic import");
    else if (ts.isCallExpression(node) && ts.isIdentifier(node.expression) && node.expression.text === "require" && node.arguments.length === 1)
      add(node, node.arguments[0], "require");
    else if (ts.isNewExpression(node) && ts.isIdentifier(node.expression) && node.expression.text === "URL" && isImportMetaUrl(node.arguments?.[1]))
      add(node, node.arguments![0], "new URL");
    ts.forEachChild(node, visit);
  };
  visit(source);
  return { references, unreadable };
}

function codeFilesUnder(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return codeFilesUnder(path);
    return codeExtensions.has(extname(entry.name)) ? [path] : [];
  });
}

const isInside = (path: string, dir: string) => path === dir || path.startsWith(dir + sep);
const folderOf = (path: string) => relative(libDir, path).split(sep)[0];
const show = (path: string) => relative(repoDir, path).split(sep).join("/");

interface Edge {
  from: string;
  to: string;
  /** "lib/sheet/x.ts:3 imports ../build/y.ts", through any file outside lib/ in between. */
  evidence: string;
}

interface Graph {
  edges: Edge[];
  /** Packages and node: modules, by the lib/ file that imports them. */
  external: Array<{ file: string; specifier: string; line: number }>;
  unreadable: string[];
  /** Code files directly in lib/, which belong to no folder. */
  loose: string[];
  /** Code files outside lib/ that lib/ imports, read for the lib/ files they import in turn. */
  followed: Set<string>;
}

/** The lib/ files and folders a reference reaches, following code files outside lib/ to the lib/ files they import. */
function libTargets(target: string, seen: Set<string>, followed: Set<string>): Array<{ path: string; via: string[] }> {
  if (isInside(target, libDir)) return [{ path: target, via: [] }];
  if (seen.has(target) || !codeExtensions.has(extname(target))) return [];
  seen.add(target);
  followed.add(show(target));
  let text: string;
  try {
    text = readFileSync(target, "utf8");
  } catch {
    return [];
  }
  return referencesOf(target, text).references.flatMap((r) =>
    r.specifier.startsWith(".")
      ? libTargets(resolve(dirname(target), r.specifier), seen, followed).map((t) => ({ path: t.path, via: [show(target), ...t.via] }))
      : [],
  );
}

function buildGraph(): Graph {
  const graph: Graph = { edges: [], external: [], unreadable: [], loose: [], followed: new Set() };
  for (const file of codeFilesUnder(libDir)) {
    const from = folderOf(file);
    if (dirname(file) === libDir) graph.loose.push(show(file));
    const { references, unreadable } = referencesOf(file, readFileSync(file, "utf8"));
    for (const u of unreadable) graph.unreadable.push(`${show(file)}:${u.line}: ${u.kind}(${u.specifier})`);
    for (const r of references) {
      if (!r.specifier.startsWith(".")) {
        graph.external.push({ file: show(file), specifier: r.specifier, line: r.line });
        continue;
      }
      for (const target of libTargets(resolve(dirname(file), r.specifier), new Set(), graph.followed)) {
        const to = folderOf(target.path);
        const via = target.via.length ? ` through ${target.via.join(", ")}` : "";
        if (to !== from && to !== "") graph.edges.push({ from, to, evidence: `${show(file)}:${r.line} ${r.kind} ${r.specifier}${via}` });
      }
    }
  }
  return graph;
}

/** Each cycle of the folder graph once, as its folders in order ("sheet → build → sheet"). */
function folderCycles(edges: Edge[]): string[][] {
  const next = new Map<string, Set<string>>();
  for (const e of edges) next.set(e.from, (next.get(e.from) ?? new Set()).add(e.to));
  const cycles = new Map<string, string[]>();
  const walk = (path: string[]) => {
    for (const to of next.get(path[path.length - 1]) ?? []) {
      const at = path.indexOf(to);
      if (at >= 0) {
        const cycle = path.slice(at);
        // One name per cycle whichever folder it was entered from: start at its smallest name.
        const start = cycle.indexOf([...cycle].sort()[0]);
        const rotated = [...cycle.slice(start), ...cycle.slice(0, start)];
        cycles.set(rotated.join(" → "), rotated);
      } else if (path.length < 12) walk([...path, to]);
    }
  };
  for (const folder of next.keys()) walk([folder]);
  return [...cycles.values()];
}

const graph = buildGraph();
const evidenceOf = (from: string, to: string) => graph.edges.find((e) => e.from === from && e.to === to)!.evidence;
const isNodeModule = (specifier: string) => specifier.startsWith("node:") || builtinModules.includes(specifier.split("/")[0]);

describe("import layers of lib/", () => {
  it("reads every import form: static, type, re-export, dynamic, import() types and new URL(…, import.meta.url)", () => {
    const text = [
      'import { a } from "./a.ts";',
      'import type { B } from "../b/b.ts";',
      'export * from "./c.ts";',
      'const d = await import("./d.ts");',
      'type E = typeof import("./e.ts").e;',
      'const worker = new Worker(new URL("./f.mjs", import.meta.url));',
      'const name = "g.ts"; await import(name);',
      'const other = new URL("https://example.org/h");',
    ].join("\n");
    const { references, unreadable } = referencesOf("sample.ts", text);
    expect(references.map((r) => [r.kind, r.specifier, r.line])).toEqual([
      ["import", "./a.ts", 1],
      ["import", "../b/b.ts", 2],
      ["export", "./c.ts", 3],
      ["dynamic import", "./d.ts", 4],
      ["import type", "./e.ts", 5],
      ["new URL", "./f.mjs", 6],
    ]);
    expect(unreadable.map((r) => [r.kind, r.specifier, r.line])).toEqual([["dynamic import", "name", 7]]);
  });

  it("finds a cycle and names its folders in order", () => {
    const edges = [
      { from: "sheet", to: "build", evidence: "" },
      { from: "build", to: "site", evidence: "" },
      { from: "site", to: "sheet", evidence: "" },
      { from: "site", to: "core", evidence: "" },
    ];
    expect(folderCycles(edges)).toEqual([["build", "site", "sheet"]]);
  });

  it("can read where every import of lib/ goes (no computed import paths)", () => {
    expect(graph.unreadable, "write the path as a string literal so the layers can be checked").toEqual([]);
  });

  it("has every code file inside a folder that has a layer", () => {
    expect(graph.loose, "move the file into the lib/ folder that owns it").toEqual([]);
    const folders = new Set(codeFilesUnder(libDir).map(folderOf));
    const unlisted = [...folders].filter((f) => !rankOf.has(f));
    expect(unlisted, "add the folder to `layers` in test/importLayers.test.ts and to lib/README.md").toEqual([]);
  });

  it("has no import cycle between lib/ folders", () => {
    const described = folderCycles(graph.edges).map((cycle) => {
      const steps = cycle.map((from, i) => {
        const to = cycle[(i + 1) % cycle.length];
        return `  ${from} → ${to}: ${evidenceOf(from, to)}`;
      });
      return `${[...cycle, cycle[0]].join(" → ")}\n${steps.join("\n")}`;
    });
    expect(described, "folder cycles (move what both sides need into lib/shared or the lower folder)").toEqual([]);
  });

  it("keeps lib/core free of other folders, of Node's modules and of packages not listed as browser-safe", () => {
    const outside = [
      ...graph.edges.filter((e) => e.from === "core").map((e) => e.evidence),
      ...graph.external
        .filter((x) => x.file.startsWith("lib/core/") && !corePackages.has(x.specifier))
        .map((x) => `${x.file}:${x.line} imports ${x.specifier}${isNodeModule(x.specifier) ? " (a Node module)" : " (a package)"}`),
    ];
    expect(outside, "lib/core runs in the browser and in tests as pure functions: pass the data in (a package with no Node API may join corePackages)").toEqual(
      [],
    );
  });

  it("keeps the renderers (plot, site, sheet, browser) from importing one another", () => {
    const between = graph.edges.filter((e) => renderers.has(e.from) && renderers.has(e.to)).map((e) => `${e.from} → ${e.to}: ${e.evidence}`);
    expect(between, "what two renderers share belongs in lib/shared (or lib/format if it is text)").toEqual([]);
  });

  it("imports only downwards, in the order of lib/README.md", () => {
    const upwards = graph.edges
      .filter((e) => rankOf.has(e.from) && rankOf.has(e.to) && rankOf.get(e.to)! >= rankOf.get(e.from)! && !(renderers.has(e.from) && renderers.has(e.to)))
      .map((e) => `${e.from} → ${e.to}: ${e.evidence}`);
    expect(upwards, "a folder may import only the folders listed below it").toEqual([]);
  });

  it("sees the edges it is meant to see", () => {
    // Guards the check itself: were the graph read wrongly (no .mjs, no dynamic imports, nothing
    // followed outside lib/), the tests above would pass on an empty graph.
    const folders = new Set(graph.edges.map((e) => `${e.from}→${e.to}`));
    expect(folders.has("atlas→core")).toBe(true);
    expect(folders.has("cli→build")).toBe(true);
    expect(graph.external.some((x) => x.file.startsWith("lib/") && x.specifier.startsWith("node:"))).toBe(true);
    expect([...graph.followed]).toContain("eleventy.config.ts");
  });
});
