import type { AtlasEntry } from "../atlas/index.ts";
import { bandOverviewDescription, bandOverviewSpec, type IntensityScale } from "./bandOverviewSpec.ts";
import { renderSpecToSvg } from "./renderSvg.ts";

export async function bandOverviewSvg(entry: AtlasEntry, scale: IntensityScale, size?: { width: number; height: number }): Promise<string> {
  return renderSpecToSvg(bandOverviewSpec(entry, scale, size), bandOverviewDescription(entry, scale));
}
