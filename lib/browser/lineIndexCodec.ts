// The wavenumber-search index shipped with the site: every line of the atlas at one temperature
// (the same lines `bandatlas find` searches), packed as
//   Float64 wavenumber[n] | Float64 relativeIntensity[n] | Uint16 group[n] | Uint16 label[n]
// = 20 bytes a line, base64 in a small JSON file. Wavenumbers and intensities stay exact doubles
// so the browser's answer is the CLI's answer digit for digit; groups (molecule, species, band,
// page) and labels ("R(12)") are small tables referenced by index.
import type { LocatedLine } from "../core/nearbyLines.ts";

export const lineIndexFormat = "bandatlas-line-index-1";
export const lineIndexBytesPerLine = 20;

export interface LineIndexFile {
  format: typeof lineIndexFormat;
  temperatureK: number;
  minRelative: number;
  count: number;
  /** [molecule, species, band, page path] */
  groups: Array<[string, string, string, string]>;
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

const compareLines = (a: LocatedLine, b: LocatedLine) =>
  a.wavenumber - b.wavenumber || a.molecule.localeCompare(b.molecule) || a.species.localeCompare(b.species) || a.band.localeCompare(b.band) || a.label.localeCompare(b.label);

export function encodeLineIndex(lines: LocatedLine[], pageOf: (line: LocatedLine) => string, temperatureK: number, minRelative: number): LineIndexFile {
  const sorted = [...lines].sort(compareLines);
  const groups: LineIndexFile["groups"] = [];
  const groupIds = new Map<string, number>();
  const labels: string[] = [];
  const labelIds = new Map<string, number>();
  const n = sorted.length;
  const buffer = new ArrayBuffer(n * lineIndexBytesPerLine);
  const wavenumbers = new Float64Array(buffer, 0, n);
  const intensities = new Float64Array(buffer, 8 * n, n);
  const groupOf = new Uint16Array(buffer, 16 * n, n);
  const labelOf = new Uint16Array(buffer, 18 * n, n);
  sorted.forEach((line, i) => {
    const key = `${line.molecule}\u0000${line.species}\u0000${line.band}`;
    let g = groupIds.get(key);
    if (g === undefined) {
      g = groups.length;
      groups.push([line.molecule, line.species, line.band, pageOf(line)]);
      groupIds.set(key, g);
    }
    let l = labelIds.get(line.label);
    if (l === undefined) {
      l = labels.length;
      labels.push(line.label);
      labelIds.set(line.label, l);
    }
    if (g > 0xffff || l > 0xffff) throw new Error("line index: more than 65536 groups or labels");
    wavenumbers[i] = line.wavenumber;
    intensities[i] = line.relativeIntensity;
    groupOf[i] = g;
    labelOf[i] = l;
  });
  // Typed arrays use the platform's byte order; every browser and Node platform we target is
  // little-endian, and decodeLineIndex refuses to run on any other.
  return { format: lineIndexFormat, temperatureK, minRelative, count: n, groups, labels, data: toBase64(new Uint8Array(buffer)) };
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
  const bytes = fromBase64(file.data);
  const n = file.count;
  if (bytes.length !== n * lineIndexBytesPerLine) throw new Error("line index: truncated data");
  const buffer = bytes.buffer;
  const wavenumbers = new Float64Array(buffer, 0, n);
  const intensities = new Float64Array(buffer, 8 * n, n);
  const groupOf = new Uint16Array(buffer, 16 * n, n);
  const labelOf = new Uint16Array(buffer, 18 * n, n);
  return {
    temperatureK: file.temperatureK,
    minRelative: file.minRelative,
    wavenumbers,
    line(i) {
      const [molecule, species, band, page] = file.groups[groupOf[i]];
      return { molecule, species, band, label: file.labels[labelOf[i]], wavenumber: wavenumbers[i], relativeIntensity: intensities[i], page };
    },
  };
}
