// URL conventions of the built site, in one place: pages, downloads, bench sheets, row anchors.
// Every path is relative to the site root and has no leading slash, so pages can link to each
// other with relative URLs and the site also works when opened from disk.

/** The temperature as printed in URLs and file names: 296, 273.15, 1000 (no trailing zeros). */
export function temperatureToken(temperatureK: number): string {
  return String(temperatureK);
}

export function moleculePagePath(moleculeId: string): string {
  return `molecules/${moleculeId}/index.html`;
}

export function speciesPageDir(moleculeId: string, species: string, temperatureK: number): string {
  return `molecules/${moleculeId}/${species}-${temperatureToken(temperatureK)}K`;
}

export function speciesPagePath(moleculeId: string, species: string, temperatureK: number): string {
  return `${speciesPageDir(moleculeId, species, temperatureK)}/index.html`;
}

/** The bench page of a molecule: the visitor's cell and instrument, computed in the browser. */
export function benchPagePath(moleculeId: string): string {
  return `molecules/${moleculeId}/bench/index.html`;
}

/** The calibrate page: a measured spectrum of a gas cell against the atlas, computed in the browser. */
export function calibratePagePath(): string {
  return "calibrate/index.html";
}

/** The cell model (species, bands, intensity data, broadening) the bench page computes from. */
export function benchModelPath(moleculeId: string): string {
  return `molecules/${moleculeId}/bench/cell-model.json`;
}

/** One band's table as a download: same bytes as `bandatlas lines --format csv|json`. */
export function downloadPath(moleculeId: string, species: string, temperatureK: number, bandLabel: string, format: "csv" | "json"): string {
  return `${speciesPageDir(moleculeId, species, temperatureK)}/${moleculeId}-${species}-${temperatureToken(temperatureK)}K-${bandLabel}.${format}`;
}

/** A bench sheet: the pages link here and lib/sheet writes the file here. sheets/<moleculeId>/<species>-<T>K-<a4|letter>.pdf. */
export function sheetPath(moleculeId: string, species: string, temperatureK: number, paper: "a4" | "letter"): string {
  return `sheets/${moleculeId}/${species}-${temperatureToken(temperatureK)}K-${paper}.pdf`;
}

/** The id of a line's table row, unique on its page: line-1-0-R0, line-2-0-P12. */
export function lineRowId(bandLabel: string, lineLabel: string): string {
  return `line-${bandLabel}-${lineLabel.replace(/[()]/g, "")}`;
}

/** A relative URL from one site path to another (both relative to the site root). */
export function relativeUrl(fromPath: string, toPath: string): string {
  const fromDirs = fromPath.split("/").slice(0, -1);
  const to = toPath.split("/");
  let common = 0;
  while (common < fromDirs.length && common < to.length - 1 && fromDirs[common] === to[common]) common++;
  const up = fromDirs.length - common;
  const rest = to.slice(common).join("/");
  return "../".repeat(up) + rest;
}
