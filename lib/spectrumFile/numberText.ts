// Numbers as written in spectrum files, read strictly: Number("") is 0 and Number(" 12 ") is 12,
// so a blank or mangled field would otherwise pass as data.

const plainNumber = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const commaDecimal = /^[+-]?(?:\d+,?\d*|,\d+)(?:[eE][+-]?\d+)?$/;

/** The number in a field, or undefined when the field is not one; `decimalComma` reads "2650,12". */
export function parseNumberField(field: string, decimalComma = false): number | undefined {
  const text = field.trim();
  if (plainNumber.test(text)) return Number(text);
  if (decimalComma && commaDecimal.test(text)) return Number(text.replace(",", "."));
  return undefined;
}

/** Spellings of infinity that some exporters write, so the message can say "not finite" rather than "not a number". */
export function isInfinityWord(field: string): boolean {
  return /^[+-]?(inf|infinity|1\.#inf)$/i.test(field.trim());
}

/** A value in a message: six significant digits, no trailing zeros. */
export function shortNumber(value: number): string {
  return String(Number(value.toPrecision(6)));
}

/** "2650–3100" for a message. */
export function rangeText(values: ArrayLike<number>): string {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    min = Math.min(min, values[i]);
    max = Math.max(max, values[i]);
  }
  return `${shortNumber(min)}–${shortNumber(max)}`;
}
