import { isKnownElement } from "./isotopes.ts";
import type { IdentityFields } from "./schema.ts";

type Path = ReadonlyArray<string | number>;
export type Found = { path: Path; message: string };

export const idPattern = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

/** A source-key check for the fields of one file (none when its sources could not be read). */
export function sourceChecker(file: Partial<Pick<IdentityFields, "sources">>, add: (path: Path, message: string) => void) {
  if (file.sources === undefined) return () => {};
  const sourceKeys = Object.keys(file.sources);
  return (path: Path, key: string) => {
    if (!sourceKeys.includes(key)) add(path, `source "${key}" is not listed under \`sources\` (known: ${sourceKeys.join(", ") || "none"})`);
  };
}

/**
 * The checks every form of molecule file shares, beyond its schema: id and file name, CAS check
 * digit, element symbols, hazard codes, source links, broadening sources. A field missing here
 * failed its schema (reported there) and is skipped.
 */
export function identityProblems(file: Partial<IdentityFields>, expectedId: string | null): Found[] {
  const out: Found[] = [];
  const add = (path: Path, message: string) => out.push({ path, message });
  const checkSource = sourceChecker(file, add);
  if (file.id !== undefined && !idPattern.test(file.id))
    add(["id"], `id "${file.id}" must be lowercase letters, digits and single dashes (no spaces, dots or slashes)`);
  else if (file.id !== undefined && expectedId !== null && file.id !== expectedId) add(["id"], `id "${file.id}" must match the file name "${expectedId}.yaml"`);
  if (file.casNumber === undefined) {
    // Reported by the schema.
  } else if (!/^\d{2,7}-\d{2}-\d$/.test(file.casNumber)) add(["casNumber"], `CAS number "${file.casNumber}" is not of the form 1234-56-7`);
  else {
    // CAS check digit: the last digit is Σ (position × digit) mod 10 over the others, counted from the right.
    const digits = file.casNumber.replace(/-/g, "");
    const body = digits.slice(0, -1).split("").reverse();
    const sum = body.reduce((s, d, i) => s + (i + 1) * Number(d), 0);
    if (sum % 10 !== Number(digits.at(-1))) add(["casNumber"], `CAS number "${file.casNumber}" fails its check digit (expected ${sum % 10} at the end)`);
  }
  file.atoms?.forEach((symbol, i) => {
    if (!isKnownElement(symbol)) add(["atoms", i], `"${symbol}" is not an element symbol (write it as in the periodic table, e.g. Cl, Br)`);
  });
  file.hazard?.ghsPictograms.forEach((code, i) => {
    if (file.hazard!.ghsPictograms.indexOf(code) !== i) add(["hazard", "ghsPictograms", i], `${code} is listed twice`);
  });

  for (const [key, source] of Object.entries(file.sources ?? {})) {
    if (source.url !== undefined && !/^https?:\/\/[^\s<>"']+$/i.test(source.url))
      add(["sources", key, "url"], `a source address must be an https: or http: link, got "${source.url}"`);
    if (source.doi !== undefined && !/^10\.\d{4,9}\/[^\s<>"']+$/.test(source.doi))
      add(["sources", key, "doi"], `a DOI looks like 10.1016/0022-2852(79)90117-0, got "${source.doi}"`);
  }

  if (file.broadening) {
    for (const which of ["self", "air"] as const) checkSource(["broadening", which, "source"], file.broadening[which].source);
  }
  for (const which of ["self", "air"] as const) {
    const shift = file.pressureShift?.[which];
    if (shift) checkSource(["pressureShift", which, "source"], shift.source);
  }
  return out;
}
