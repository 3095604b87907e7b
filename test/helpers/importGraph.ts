// The import graph of lib/'s folders, read with TypeScript's own parser, for test/importLayers.test.ts.
// Every import form counts: static imports and re-exports (types too), literal dynamic import(),
// import("…") types, and new URL("…", import.meta.url), which is how worker entries and bundle
// entries name their files. A file outside lib/ that lib/ imports (eleventy.config.ts) is followed,
// so an edge cannot hide behind it.
import { readdirSync, readFileSync } from "node:fs";
import { dirname, extname, join, relative, resolve, sep } from "node:path";
import ts from "typescript";

const repoDir = resolve(import.meta.dirname, "../..");
export const libDir = join(repoDir, "lib");

export const codeExtensions = new Set([".ts", ".mts", ".cts", ".mjs", ".js", ".cjs"]);

export interface Reference {
  specifier: string;
  kind: "import" | "export" | "dynamic import" | "import type" | "require" | "new URL";
  line: number;
}

/** Every module a file names, and the places where it names one the check cannot read (a computed path). */
export function referencesOf(fileName: string, text: string): { references: Reference[]; unreadable: Reference[] } {
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

export function codeFilesUnder(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return codeFilesUnder(path);
    return codeExtensions.has(extname(entry.name)) ? [path] : [];
  });
}

const isInside = (path: string, dir: string) => path === dir || path.startsWith(dir + sep);
export const folderOf = (path: string) => relative(libDir, path).split(sep)[0];
const show = (path: string) => relative(repoDir, path).split(sep).join("/");

export interface Edge {
  from: string;
  to: string;
  /** "lib/sheet/x.ts:3 imports ../build/y.ts", through any file outside lib/ in between. */
  evidence: string;
}

export interface Graph {
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

export function buildGraph(): Graph {
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
export function folderCycles(edges: Edge[]): string[][] {
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
