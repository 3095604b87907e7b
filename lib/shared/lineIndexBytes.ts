// The byte-level steps of the wavenumber-search index (lineIndexCodec.ts): base64, byte planes,
// differences of the sorted wavenumbers' bit patterns, and first-seen numbering of small tables.
// Each step is exact and undone on load.
export function toBase64(bytes: Uint8Array): string {
  let binary = "";
  for (let i = 0; i < bytes.length; i += 0x8000) binary += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(binary);
}

export function fromBase64(text: string): Uint8Array {
  const binary = atob(text);
  const bytes = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) bytes[i] = binary.charCodeAt(i);
  return bytes;
}

export function fromPlanes(planes: Uint8Array, width: number, out: Uint8Array): void {
  const count = planes.length / width;
  for (let b = 0; b < width; b++) {
    const plane = b * count;
    for (let i = 0; i < count; i++) out[i * width + b] = planes[plane + i];
  }
}

/**
 * Sorted positive doubles as differences of their bit patterns (little-endian 32-bit halves,
 * exact), in place: from the last line down, each line's pattern less the one before it.
 */
export function deltaBitsInPlace(values: Float64Array): Uint32Array {
  const halves = new Uint32Array(values.buffer, values.byteOffset, 2 * values.length);
  for (let i = values.length - 1; i >= 0; i--) {
    const lo = i > 0 ? halves[2 * i - 2] : 0;
    const hi = i > 0 ? halves[2 * i - 1] : 0;
    const l = halves[2 * i];
    const h = halves[2 * i + 1];
    const borrow = l < lo ? 1 : 0;
    halves[2 * i] = (l - lo) >>> 0;
    halves[2 * i + 1] = (h - hi - borrow) >>> 0;
  }
  return halves;
}

export function undoDeltaBits(deltas: Uint32Array): void {
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

/** Byte planes of `width`-byte items written straight into `out` (item i's byte b at b·count + i). */
export function planesInto(bytes: Uint8Array, width: number, out: Uint8Array): void {
  const count = bytes.length / width;
  for (let i = 0; i < count; i++) for (let b = 0; b < width; b++) out[b * count + i] = bytes[i * width + b];
}

/** Numbers distinct keys 0, 1, 2 … in the order they are first seen, keeping a value for each. */
export class FirstSeenNumbering<K, V> {
  readonly values: V[] = [];
  private ids = new Map<K, number>();

  id(key: K, value: () => V): number {
    let id = this.ids.get(key);
    if (id === undefined) {
      id = this.values.length;
      this.values.push(value());
      this.ids.set(key, id);
    }
    return id;
  }
}

/** Lines per storage chunk of a builder: columns grow a chunk at a time, never copied. */
