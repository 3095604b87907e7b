import type { PaperName } from "./paper.ts";

/** 296 → "296K", 298.15 → "298.15K": the shortest digits that give the temperature back. */
export function temperatureLabel(temperatureK: number): string {
  return `${String(temperatureK)}K`;
}

/** `<species>-<T>K-<paper>.pdf`, the name of a sheet inside its molecule's folder. */
export function sheetFileName(species: string, temperatureK: number, paper: PaperName): string {
  return `${species}-${temperatureLabel(temperatureK)}-${paper}.pdf`;
}
