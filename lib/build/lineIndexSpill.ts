import { appendFileSync, closeSync, openSync, readSync, statSync } from "node:fs";
import { lineIndexChunkLines, type LineIndexChunk, type LineIndexChunkStore } from "../shared/lineIndexCodec.ts";

const doubleBytes = 8 * lineIndexChunkLines;
const shortBytes = 2 * lineIndexChunkLines;
/** One full chunk on disk: wavenumbers, intensities, uncertainties, groups, labels, each column whole (a multiple of 8 bytes). */
const chunkBytes = 3 * doubleBytes + 2 * shortBytes;

/**
 * A search-index builder's full chunks kept in a file until the index is finished: with three
 * temperatures of a large atlas held in memory (28 bytes a line each), the builders were the
 * largest thing that grew with the atlas during a build. Finishing reads one temperature back.
 */
export function fileChunkStore(path: string): LineIndexChunkStore {
  let saved = 0;
  return {
    save(chunk) {
      for (const column of [chunk.wavenumbers, chunk.intensities, chunk.uncertainties, chunk.groupOf, chunk.labelOf])
        appendFileSync(path, new Uint8Array(column.buffer, column.byteOffset, column.byteLength));
      saved++;
    },
    loadAll() {
      if (saved === 0) return [];
      const size = statSync(path).size;
      if (size !== saved * chunkBytes) throw new Error(`search index: ${path} holds ${size} bytes, expected ${saved * chunkBytes}`);
      // Read straight into one ArrayBuffer, so the Float64 views are aligned and nothing is copied.
      const buffer = new ArrayBuffer(size);
      const fd = openSync(path, "r");
      try {
        for (let at = 0; at < size;) at += readSync(fd, new Uint8Array(buffer, at, size - at), 0, size - at, at);
      } finally {
        closeSync(fd);
      }
      const chunks: LineIndexChunk[] = [];
      for (let k = 0, at = 0; k < saved; k++, at += chunkBytes) {
        chunks.push({
          wavenumbers: new Float64Array(buffer, at, lineIndexChunkLines),
          intensities: new Float64Array(buffer, at + doubleBytes, lineIndexChunkLines),
          uncertainties: new Float64Array(buffer, at + 2 * doubleBytes, lineIndexChunkLines),
          groupOf: new Uint16Array(buffer, at + 3 * doubleBytes, lineIndexChunkLines),
          labelOf: new Uint16Array(buffer, at + 3 * doubleBytes + shortBytes, lineIndexChunkLines),
        });
      }
      return chunks;
    },
  };
}
