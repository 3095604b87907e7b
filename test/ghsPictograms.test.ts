import { describe, expect, it } from "vitest";
import { ghsPictogramName, ghsPictogramText } from "../lib/shared/ghsPictograms.ts";

// UN GHS, chapter 1.4 and Annex 1: GHS04 is the gas cylinder (gases under pressure), GHS06 the
// skull and crossbones (acute toxicity); fact of the trade, from memory.
describe("GHS pictogram wording", () => {
  it("names the symbol and the hazard on pages, the code and the symbol on sheets", () => {
    expect(ghsPictogramName("GHS04")).toBe("gas cylinder (gas under pressure)");
    expect(ghsPictogramName("GHS06")).toBe("skull and crossbones (acutely toxic)");
    expect(ghsPictogramText("GHS04")).toBe("GHS04 (gas cylinder)");
    expect(ghsPictogramText("GHS06")).toBe("GHS06 (skull and crossbones)");
  });

  it("never hides a code it does not know", () => {
    expect(ghsPictogramName("GHS99")).toBe("pictogram");
    expect(ghsPictogramText("GHS99")).toBe("GHS99");
  });
});
