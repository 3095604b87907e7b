// The wavenumber-search index shipped with the site: every line of the atlas at one temperature
// (the same lines `bandatlas find` searches), packed as four columns
//   wavenumber[n] | relativeIntensity[n] | Uint16 group[n] | Uint16 label[n]
// = 20 bytes a line, base64 in a small JSON file. Wavenumbers and intensities stay exact doubles
// so the browser's answer is the CLI's answer digit for digit; groups (molecule, species, band,
// page, and the band's factor from band-relative to gas-relative strength) and labels ("R(12)")
// are small tables referenced by index.
// Packed for gzip (web servers send it compressed): the lines are sorted, so the 64-bit patterns
// of the positive wavenumbers rise too and are stored as differences from the previous line's; each
// column is then split into byte planes (all first bytes, then all second bytes, ...), so the
// near-constant high bytes of a double become long runs. Both steps are exact and undone on load.
import type { LocatedLine } from "../core/nearbyLines.ts";

export const lineIndexFormat = "bandatlas-line-index-3";
export const lineIndexBytesPerLine = 20;

export interface LineIndexFile {
  format: typeof lineIndexFormat;
  temperatureK: number;
  minRelative: number;
  count: number;
  /** [molecule, species, band, page path, gas factor]: a line's gas-relative strength is its band-relative one × the factor (null: not sourced). */
  groups: Array<[string, string, string, string, number | null]>;
  labels: string[];
  data: string;
}

export interface IndexedLine extends LocatedLine {
  page: string;
}

function toBase64(bytes: Uint8Array): string {
  let binary = "";
  for (let i = 0; i < bytes.length; i += 0x8000) binary += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(binary);
}

function fromBase64(text: string): Uint8Array {
  const binary = atob(text);
  const bytes = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) bytes[i] = binary.charCodeAt(i);
  return bytes;
}

/** Byte planes of `width`-byte items: item i's byte b goes to b·count + i. */
function toPlanes(bytes: Uint8Array, width: number): Uint8Array {
  const count = bytes.length / width;
  const out = new Uint8Array(bytes.length);
  for (let i = 0; i < count; i++) for (let b = 0; b < width; b++) out[b * count + i] = bytes[i * width + b];
  return out;
}

function fromPlanes(planes: Uint8Array, width: number, out: Uint8Array): void {
  const count = planes.length / width;
  for (let b = 0; b < width; b++) {
    const plane = b * count;
    for (let i = 0; i < count; i++) out[i * width + b] = planes[plane + i];
  }
}

/** Sorted positive doubles as differences of their bit patterns (little-endian 32-bit halves, exact). */
function deltaBits(values: Float64Array): Uint32Array {
  const halves = new Uint32Array(values.buffer.slice(values.byteOffset, values.byteOffset + values.byteLength));
  const out = new Uint32Array(halves.length);
  let lo = 0;
  let hi = 0;
  for (let i = 0; i < values.length; i++) {
    const l = halves[2 * i];
    const h = halves[2 * i + 1];
    const borrow = l < lo ? 1 : 0;
    out[2 * i] = (l - lo) >>> 0;
    out[2 * i + 1] = (h - hi - borrow) >>> 0;
    lo = l;
    hi = h;
  }
  return out;
}

function undoDeltaBits(deltas: Uint32Array): void {
  let lo = 0;
  let hi = 0;
  for (let i = 0; i < deltas.length / 2; i++) {
    const sum = lo + deltas[2 * i];
    const carry = sum > 0xffffffff ? 1 : 0;
    lo = sum >>> 0;
    hi = (hi + deltas[2 * i + 1] + carry) >>> 0;
    deltas[2 * i] = lo;
    deltas[2 * i + 1] = hi;
  }
}

/**
 * Gathers an index's lines a few at a time (a build adds each batch of molecules and drops their
 * entries) in compact columns, about 24 bytes a line instead of a line object, and encodes them
 * all at the end exactly as if they had come in one list.
 */
export class LineIndexBuilder {
  private n = 0;
  private wavenumbers = new Float64Array(1024);
  private intensities = new Float64Array(1024);
  private groupOf = new Uint32Array(1024);
  private labelOf = new Uint32Array(1024);
  private groups: LineIndexFile["groups"] = [];
  private groupIds = new Map<string, number>();
  private labels: string[] = [];
  private labelIds = new Map<string, number>();

  constructor(
    private readonly temperatureK: number,
    private readonly minRelative: number,
  ) {}

  add(lines: readonly LocatedLine[], pageOf: (line: LocatedLine) => string): void {
    for (const line of lines) {
      const key = `${line.molecule}\u0000${line.species}\u0000${line.band}`;
      let g = this.groupIds.get(key);
      if (g === undefined) {
        g = this.groups.length;
        // Every line of a group shares its band's factor: gas-relative = band-relative × factor.
        this.groups.push([line.molecule, line.species, line.band, pageOf(line), line.bandToGas]);
        this.groupIds.set(key, g);
      }
      let l = this.labelIds.get(line.label);
      if (l === undefined) {
        l = this.labels.length;
        this.labels.push(line.label);
        this.labelIds.set(line.label, l);
      }
      if (this.n === this.wavenumbers.length) this.grow();
      this.wavenumbers[this.n] = line.wavenumber;
      this.intensities[this.n] = line.relativeIntensity;
      this.groupOf[this.n] = g;
      this.labelOf[this.n] = l;
      this.n++;
    }
  }

  private grow(): void {
    const size = 2 * this.wavenumbers.length;
    const bigger = <T extends Float64Array | Uint32Array>(old: T, make: (n: number) => T): T => {
      const out = make(size);
      out.set(old as never);
      return out;
    };
    this.wavenumbers = bigger(this.wavenumbers, (k) => new Float64Array(k));
    this.intensities = bigger(this.intensities, (k) => new Float64Array(k));
    this.groupOf = bigger(this.groupOf, (k) => new Uint32Array(k));
    this.labelOf = bigger(this.labelOf, (k) => new Uint32Array(k));
  }

  get count(): number {
    return this.n;
  }

  /**
   * The file: lines sorted by wavenumber (ties by molecule, species, band, label), groups and
   * labels numbered in the order the sorted lines first use them.
   */
  finish(): LineIndexFile {
    const n = this.n;
    const { wavenumbers: w, groups: g, labels: lb, groupOf, labelOf } = this;
    const order = Array.from({ length: n }, (_, i) => i);
    order.sort((a, b) => {
      const ga = g[groupOf[a]];
      const gb = g[groupOf[b]];
      return (
        w[a] - w[b] || ga[0].localeCompare(gb[0]) || ga[1].localeCompare(gb[1]) || ga[2].localeCompare(gb[2]) || lb[labelOf[a]].localeCompare(lb[labelOf[b]])
      );
    });
    const groups: LineIndexFile["groups"] = [];
    const groupIds = new Map<number, number>();
    const labels: string[] = [];
    const labelIds = new Map<number, number>();
    const buffer = new ArrayBuffer(n * lineIndexBytesPerLine);
    const wavenumbers = new Float64Array(buffer, 0, n);
    const intensities = new Float64Array(buffer, 8 * n, n);
    const groupColumn = new Uint16Array(buffer, 16 * n, n);
    const labelColumn = new Uint16Array(buffer, 18 * n, n);
    order.forEach((from, i) => {
      let group = groupIds.get(groupOf[from]);
      if (group === undefined) {
        group = groups.length;
        groups.push(g[groupOf[from]]);
        groupIds.set(groupOf[from], group);
      }
      let label = labelIds.get(labelOf[from]);
      if (label === undefined) {
        label = labels.length;
        labels.push(lb[labelOf[from]]);
        labelIds.set(labelOf[from], label);
      }
      if (group > 0xffff || label > 0xffff) throw new Error("line index: more than 65536 groups or labels");
      wavenumbers[i] = w[from];
      intensities[i] = this.intensities[from];
      groupColumn[i] = group;
      labelColumn[i] = label;
    });
    if (n > 0 && !(wavenumbers[0] > 0)) throw new Error("line index: wavenumbers must be positive");
    // Typed arrays use the platform's byte order; every browser and Node platform we target is
    // little-endian, and decodeLineIndex refuses to run on any other.
    const packed = new Uint8Array(n * lineIndexBytesPerLine);
    packed.set(toPlanes(new Uint8Array(deltaBits(wavenumbers).buffer), 8), 0);
    packed.set(toPlanes(new Uint8Array(buffer, 8 * n, 8 * n), 8), 8 * n);
    packed.set(toPlanes(new Uint8Array(buffer, 16 * n, 2 * n), 2), 16 * n);
    packed.set(toPlanes(new Uint8Array(buffer, 18 * n, 2 * n), 2), 18 * n);
    return { format: lineIndexFormat, temperatureK: this.temperatureK, minRelative: this.minRelative, count: n, groups, labels, data: toBase64(packed) };
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
  fromPlanes(packed.subarray(16 * n, 18 * n), 2, bytes.subarray(16 * n, 18 * n));
  fromPlanes(packed.subarray(18 * n, 20 * n), 2, bytes.subarray(18 * n, 20 * n));
  const wavenumbers = new Float64Array(buffer, 0, n);
  const intensities = new Float64Array(buffer, 8 * n, n);
  const groupOf = new Uint16Array(buffer, 16 * n, n);
  const labelOf = new Uint16Array(buffer, 18 * n, n);
  return {
    temperatureK: file.temperatureK,
    minRelative: file.minRelative,
    wavenumbers,
    line(i) {
      const [molecule, species, band, page, factor] = file.groups[groupOf[i]];
      const relativeIntensity = intensities[i];
      return {
        molecule,
        species,
        band,
        label: file.labels[labelOf[i]],
        wavenumber: wavenumbers[i],
        relativeIntensity,
        gasRelativeIntensity: factor === null ? null : relativeIntensity * factor,
        bandToGas: factor,
        page,
      };
    },
  };
}
