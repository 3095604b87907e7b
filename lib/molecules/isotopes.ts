import * as chemicalElementsModule from "chemical-elements";

// Atomic masses and natural abundances come from the registry package `chemical-elements`
// (masses of the AME atomic mass evaluation, abundances of the IUPAC isotopic compositions);
// no mass is typed by hand in this project.
export interface IsotopeData {
  symbol: string;
  massNumber: number;
  massU: number;
  abundance: number | null;
}

interface RawIsotope {
  nominal: number;
  mass?: number;
  abundance?: number;
}
// The package is CommonJS: under ESM its exports arrive as `default`, under CJS loaders directly.
const chemicalElements = ((chemicalElementsModule as { default?: unknown }).default ?? chemicalElementsModule) as {
  elementsAndIsotopesObject: Record<string, { isotopes: RawIsotope[] } | undefined>;
};
const elements = chemicalElements.elementsAndIsotopesObject;

export function isKnownElement(symbol: string): boolean {
  return Object.prototype.hasOwnProperty.call(elements, symbol) && elements[symbol] !== undefined;
}

export function isotope(symbol: string, massNumber: number): IsotopeData | null {
  if (!isKnownElement(symbol)) return null;
  const found = elements[symbol]!.isotopes.find((i) => i.nominal === massNumber);
  if (!found || typeof found.mass !== "number") return null;
  return { symbol, massNumber, massU: found.mass, abundance: typeof found.abundance === "number" ? found.abundance : null };
}

export function mostAbundantMassNumber(symbol: string): number | null {
  if (!isKnownElement(symbol)) return null;
  let best: RawIsotope | null = null;
  for (const i of elements[symbol]!.isotopes) if (i.abundance && (!best || i.abundance > (best.abundance ?? 0))) best = i;
  return best?.nominal ?? null;
}

export function stableMassNumbers(symbol: string): number[] {
  if (!isKnownElement(symbol)) return [];
  return elements[symbol]!.isotopes.filter((i) => i.abundance).map((i) => i.nominal);
}
