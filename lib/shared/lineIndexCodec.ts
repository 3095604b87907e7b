// The wavenumber-search index shipped with the site: every line of the atlas at one temperature
// (the same lines `bandatlas find` searches), packed as five columns
//   wavenumber[n] | relativeIntensity[n] | wavenumberUncertainty[n] | Uint16 group[n] | Uint16 label[n]
// = 28 bytes a line, base64 in a small JSON file. Wavenumbers, intensities and ± stay exact
// doubles so the browser's answer is the CLI's answer digit for digit (a position is printed to
// the decimal of its ±); groups (molecule, species, band, page, the band's factor from
// band-relative to gas-relative strength, and the lines' position status: a validated band's
// lines outside its measured range form a second group) and labels ("R(12)") are small tables
// referenced by index.
// Packed for gzip (web servers send it compressed): the lines are sorted, so the 64-bit patterns
// of the positive wavenumbers rise too and are stored as differences from the previous line's; each
// column is then split into byte planes (all first bytes, then all second bytes, ...), so the
// near-constant high bytes of a double become long runs. Both steps are exact and undone on load.
import type { LocatedLine } from "../core/spectra/nearbyLines.ts";
import { toBase64, fromBase64, fromPlanes, deltaBitsInPlace, undoDeltaBits, planesInto, FirstSeenNumbering } from "./lineIndexBytes.ts";

export const lineIndexFormat = "bandatlas-line-index-4";
export const lineIndexBytesPerLine = 28;

export interface LineIndexFile {
  format: typeof lineIndexFormat;
  temperatureK: number;
  minRelative: number;
  count: number;
  /** [molecule, species, band, page path, gas factor, position status]: a line's gas-relative strength is its band-relative one × the factor (null: not sourced). */
  groups: Array<[string, string, string, string, number | null, LocatedLine["positionStatus"]]>;
  labels: string[];
  data: string;
}

export interface IndexedLine extends LocatedLine {
  page: string;
}

const chunkLines = 1 << 16;

/** One chunk of a builder's columns (chunkLines lines; the last may be part full). */
export interface LineIndexChunk {
  wavenumbers: Float64Array;
  intensities: Float64Array;
  uncertainties: Float64Array;
  groupOf: Uint16Array;
  labelOf: Uint16Array;
}
type Chunk = LineIndexChunk;

export const lineIndexChunkLines = chunkLines;

/**
 * Where a builder may put its full chunks until it is finished (a build keeps them in a file, so
 * an atlas of thousands of molecules does not hold every temperature's lines in memory at once).
 */
export interface LineIndexChunkStore {
  save(chunk: LineIndexChunk): void;
  /** Every saved chunk, in the order saved. */
  loadAll(): LineIndexChunk[];
}

/** The index file without its data, and the packed bytes the data encodes (see LineIndexBuilder.finishPacked). */
export interface PackedLineIndex {
  head: Omit<LineIndexFile, "data">;
  packed: Uint8Array;
}

/**
 * Gathers an index's lines a few at a time (a build adds each batch of molecules and drops their
 * entries) in compact columns, 28 bytes a line in chunks that are never copied, and encodes them
 * all at the end exactly as if they had come in one list.
 */
export class LineIndexBuilder {
  private n = 0;
  private chunks: Chunk[] = [];
  private groups = new FirstSeenNumbering<string, LineIndexFile["groups"][number]>();
  private labels = new FirstSeenNumbering<string, string>();

  constructor(
    private readonly temperatureK: number,
    private readonly minRelative: number,
    /** Where full chunks go until finish (default: kept in memory). */
    private readonly store: LineIndexChunkStore | null = null,
  ) {}

  add(lines: readonly LocatedLine[], pageOf: (line: LocatedLine) => string): void {
    for (const line of lines) {
      // Every line of a group shares its band's factor: gas-relative = band-relative × factor.
      const g = this.groups.id(`${line.molecule}\u0000${line.species}\u0000${line.band}\u0000${line.positionStatus}`, () => [
        line.molecule,
        line.species,
        line.band,
        pageOf(line),
        line.bandToGas,
        line.positionStatus,
      ]);
      if (g > 0xffff) throw new Error("line index: more than 65536 bands of species at one temperature");
      const l = this.labels.id(line.label, () => line.label);
      if (l > 0xffff) throw new Error("line index: more than 65536 line labels");
      const at = this.n & (chunkLines - 1);
      if (at === 0 && this.store && this.chunks.length) this.store.save(this.chunks.pop()!);
      if (at === 0)
        this.chunks.push({
          wavenumbers: new Float64Array(chunkLines),
          intensities: new Float64Array(chunkLines),
          uncertainties: new Float64Array(chunkLines),
          groupOf: new Uint16Array(chunkLines),
          labelOf: new Uint16Array(chunkLines),
        });
      const chunk = this.chunks[this.chunks.length - 1];
      chunk.wavenumbers[at] = line.wavenumber;
      chunk.intensities[at] = line.relativeIntensity;
      chunk.uncertainties[at] = line.wavenumberUncertainty;
      chunk.groupOf[at] = g;
      chunk.labelOf[at] = l;
      this.n++;
    }
  }

  get count(): number {
    return this.n;
  }

  /**
   * The file: lines sorted by wavenumber (ties by molecule, species, band, label), groups and
   * labels numbered in the order the sorted lines first use them.
   */
  finish(): LineIndexFile {
    const { head, packed } = this.finishPacked();
    return { ...head, data: toBase64(packed) };
  }

  /**
   * finish() before its base64 step, so a writer can encode the data a piece at a time. The
   * builder's columns are released: it cannot be finished twice.
   */
  finishPacked(): PackedLineIndex {
    const n = this.n;
    const g = this.groups.values;
    const lb = this.labels.values;
    const chunks = [...(this.store?.loadAll() ?? []), ...this.chunks];
    this.chunks = [];
    const col = <K extends keyof Chunk>(key: K, i: number): number => chunks[i >>> 16][key][i & (chunkLines - 1)];
    const order = new Uint32Array(n);
    for (let i = 0; i < n; i++) order[i] = i;
    order.sort((a, b) => {
      const ga = g[col("groupOf", a)];
      const gb = g[col("groupOf", b)];
      return (
        col("wavenumbers", a) - col("wavenumbers", b) ||
        ga[0].localeCompare(gb[0]) ||
        ga[1].localeCompare(gb[1]) ||
        ga[2].localeCompare(gb[2]) ||
        lb[col("labelOf", a)].localeCompare(lb[col("labelOf", b)])
      );
    });
    // Groups and labels numbered again, in the order the sorted lines first use them.
    const groups = new FirstSeenNumbering<number, LineIndexFile["groups"][number]>();
    const labels = new FirstSeenNumbering<number, string>();
    const groupColumn = new Uint16Array(n);
    const labelColumn = new Uint16Array(n);
    for (let i = 0; i < n; i++) {
      const fromGroup = col("groupOf", order[i]);
      const fromLabel = col("labelOf", order[i]);
      groupColumn[i] = groups.id(fromGroup, () => g[fromGroup]);
      labelColumn[i] = labels.id(fromLabel, () => lb[fromLabel]);
    }
    // Typed arrays use the platform's byte order; every browser and Node platform we target is
    // little-endian, and decodeLineIndex refuses to run on any other. One double column at a
    // time is sorted, packed into its byte planes and dropped.
    const packed = new Uint8Array(n * lineIndexBytesPerLine);
    const sorted = new Float64Array(n);
    for (let i = 0; i < n; i++) sorted[i] = col("wavenumbers", order[i]);
    if (n > 0 && !(sorted[0] > 0)) throw new Error("line index: wavenumbers must be positive");
    planesInto(new Uint8Array(deltaBitsInPlace(sorted).buffer), 8, packed.subarray(0, 8 * n));
    for (let i = 0; i < n; i++) sorted[i] = col("intensities", order[i]);
    planesInto(new Uint8Array(sorted.buffer), 8, packed.subarray(8 * n, 16 * n));
    for (let i = 0; i < n; i++) sorted[i] = col("uncertainties", order[i]);
    planesInto(new Uint8Array(sorted.buffer), 8, packed.subarray(16 * n, 24 * n));
    planesInto(new Uint8Array(groupColumn.buffer), 2, packed.subarray(24 * n, 26 * n));
    planesInto(new Uint8Array(labelColumn.buffer), 2, packed.subarray(26 * n, 28 * n));
    return {
      head: { format: lineIndexFormat, temperatureK: this.temperatureK, minRelative: this.minRelative, count: n, groups: groups.values, labels: labels.values },
      packed,
    };
  }
}

export function encodeLineIndex(lines: LocatedLine[], pageOf: (line: LocatedLine) => string, temperatureK: number, minRelative: number): LineIndexFile {
  const builder = new LineIndexBuilder(temperatureK, minRelative);
  builder.add(lines, pageOf);
  return builder.finish();
}

export interface DecodedLineIndex {
  temperatureK: number;
  minRelative: number;
  wavenumbers: Float64Array;
  line(i: number): IndexedLine;
}

export function decodeLineIndex(file: LineIndexFile): DecodedLineIndex {
  if (file.format !== lineIndexFormat) throw new Error(`line index: unknown format ${String(file.format)}`);
  if (new Uint8Array(new Uint16Array([1]).buffer)[0] !== 1) throw new Error("line index: this machine is big-endian; the index is little-endian");
  const packed = fromBase64(file.data);
  const n = file.count;
  if (packed.length !== n * lineIndexBytesPerLine) throw new Error("line index: truncated data");
  const buffer = new ArrayBuffer(n * lineIndexBytesPerLine);
  const bytes = new Uint8Array(buffer);
  fromPlanes(packed.subarray(0, 8 * n), 8, bytes.subarray(0, 8 * n));
  undoDeltaBits(new Uint32Array(buffer, 0, 2 * n));
  fromPlanes(packed.subarray(8 * n, 16 * n), 8, bytes.subarray(8 * n, 16 * n));
  fromPlanes(packed.subarray(16 * n, 24 * n), 8, bytes.subarray(16 * n, 24 * n));
  fromPlanes(packed.subarray(24 * n, 26 * n), 2, bytes.subarray(24 * n, 26 * n));
  fromPlanes(packed.subarray(26 * n, 28 * n), 2, bytes.subarray(26 * n, 28 * n));
  const wavenumbers = new Float64Array(buffer, 0, n);
  const intensities = new Float64Array(buffer, 8 * n, n);
  const uncertainties = new Float64Array(buffer, 16 * n, n);
  const groupOf = new Uint16Array(buffer, 24 * n, n);
  const labelOf = new Uint16Array(buffer, 26 * n, n);
  return {
    temperatureK: file.temperatureK,
    minRelative: file.minRelative,
    wavenumbers,
    line(i) {
      const [molecule, species, band, page, factor, positionStatus] = file.groups[groupOf[i]];
      const relativeIntensity = intensities[i];
      return {
        molecule,
        species,
        band,
        label: file.labels[labelOf[i]],
        wavenumber: wavenumbers[i],
        wavenumberUncertainty: uncertainties[i],
        positionStatus,
        relativeIntensity,
        gasRelativeIntensity: factor === null ? null : relativeIntensity * factor,
        bandToGas: factor,
        page,
      };
    },
  };
}
