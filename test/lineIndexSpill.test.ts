// The build keeps the search index's full chunks in a file until the index is written
// (lib/build/lineIndexSpill.ts): the index must come out exactly as if they had stayed in memory.
import { mkdtempSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { fileChunkStore } from "../lib/build/lineIndexSpill.ts";
import type { LocatedLine } from "../lib/core/index.ts";
import { decodeLineIndex, LineIndexBuilder, lineIndexChunkLines } from "../lib/shared/lineIndexCodec.ts";

const work = mkdtempSync(join(tmpdir(), "bandatlas-spill-test-"));
afterAll(() => rmSync(work, { recursive: true, force: true }));

/** Invented lines (not a gas): a deterministic scatter over 500–8000 cm⁻¹ in 300 bands. */
function inventedLines(count: number): LocatedLine[] {
  let s = 12345;
  const next = () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
  return Array.from({ length: count }, (_, i) => {
    const relativeIntensity = next();
    return {
      molecule: `invented-${i % 37}`,
      species: `S${i % 3}`,
      band: `${1 + (i % 8)}-0`,
      label: `${next() < 0.5 ? "P" : "R"}(${i % 90})`,
      wavenumber: 500 + 7500 * next(),
      wavenumberUncertainty: 1e-4 * (1 + next()),
      positionStatus: i % 5 === 0 ? ("validated" as const) : ("extrapolated" as const),
      relativeIntensity,
      gasRelativeIntensity: relativeIntensity * 0.5,
      bandToGas: i % 11 === 0 ? null : 0.5,
    };
  });
}

describe("search index chunks kept in a file", () => {
  it("give the same index as chunks kept in memory, over several full chunks and a part-full last one", () => {
    const lines = inventedLines(2 * lineIndexChunkLines + 12_345);
    const page = (l: LocatedLine) => `molecules/${l.molecule}/index.html`;
    const inMemory = new LineIndexBuilder(296, 1e-3);
    const path = join(work, "lines.bin");
    const spilled = new LineIndexBuilder(296, 1e-3, fileChunkStore(path));
    // Added in uneven batches, as a build adds molecules.
    for (let at = 0; at < lines.length; at += 40_000) {
      inMemory.add(lines.slice(at, at + 40_000), page);
      spilled.add(lines.slice(at, at + 40_000), page);
    }
    // Two full chunks went to the file (20 bytes a line); the third stays in memory.
    expect(statSync(path).size).toBe(2 * lineIndexChunkLines * 28);
    const a = inMemory.finish();
    const b = spilled.finish();
    expect(b).toEqual(a);
    const decoded = decodeLineIndex(b);
    expect(decoded.wavenumbers.length).toBe(lines.length);
    const sorted = lines.map((l) => l.wavenumber).sort((x, y) => x - y);
    expect(Array.from(decoded.wavenumbers)).toEqual(sorted);
  });
});
