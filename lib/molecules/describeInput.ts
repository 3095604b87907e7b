/** Says in plain words what a YAML value turned out to be, for error messages. */
export function describeInput(input: unknown): string {
  if (input === undefined) return "nothing (the field is missing)";
  if (input === null) return "an empty value";
  if (typeof input === "string") return `the text ${JSON.stringify(input.length > 60 ? input.slice(0, 57) + "..." : input)}`;
  if (typeof input === "number") {
    if (Number.isNaN(input)) return "NaN (not a number)";
    if (!Number.isFinite(input)) return input > 0 ? "infinity" : "minus infinity";
    return `the number ${input}`;
  }
  if (typeof input === "boolean") return `the yes/no value ${input}`;
  if (Array.isArray(input)) return "a list";
  if (typeof input === "object") return "a mapping (key: value pairs)";
  return typeof input;
}

/** Levenshtein distance, for "did you mean" suggestions on misspelt keys. */
export function editDistance(a: string, b: string): number {
  const previous = Array.from({ length: b.length + 1 }, (_, i) => i);
  for (let i = 1; i <= a.length; i++) {
    let diagonal = previous[0];
    previous[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const above = previous[j];
      previous[j] = Math.min(previous[j] + 1, previous[j - 1] + 1, diagonal + (a[i - 1] === b[j - 1] ? 0 : 1));
      diagonal = above;
    }
  }
  return previous[b.length];
}

export function nearestKnown(key: string, known: string[]): string | null {
  let best: string | null = null;
  let bestDistance = Infinity;
  for (const candidate of known) {
    const d = editDistance(key.toLowerCase(), candidate.toLowerCase());
    if (d < bestDistance) {
      best = candidate;
      bestDistance = d;
    }
  }
  return best !== null && bestDistance <= Math.max(2, Math.floor(best.length / 3)) ? best : null;
}
