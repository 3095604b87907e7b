// The X value that starts each line of a JCAMP-DX ##XYDATA=(X++(Y..Y)) block, with the index of
// the point it belongs to. jcampconverter places every point on the grid FIRSTX + i·DELTAX and
// skips these values, so this is the only place they are read. Only the tokens are counted (ASDF
// forms of JCAMP-DX 4.24: SQZ, DIF, DUP and plain AFFN numbers); the Y values come from the library.

export interface XCheckValue {
  /** 1-based line in the file. */
  line: number;
  /** Index of the point this X belongs to. */
  pointIndex: number;
  /** X × XFACTOR. */
  x: number;
  /** Half the last written digit × XFACTOR: how far the value may be from the truth by rounding alone. */
  halfDigit: number;
}

type Token = { kind: "value" | "dif"; text: string } | { kind: "dup"; count: number };

const isSqz = (c: string) => /[@A-Ia-i]/.test(c);
const isDif = (c: string) => /[%J-Rj-r]/.test(c);
const isDup = (c: string) => /[S-Zs]/.test(c);
const dupValue = (c: string) => (c === "s" ? 9 : c.charCodeAt(0) - "S".charCodeAt(0) + 1);

function tokenize(line: string): Token[] {
  const tokens: Token[] = [];
  let current = "";
  const flush = () => {
    if (current === "") return;
    const first = current[0];
    if (isDup(first)) tokens.push({ kind: "dup", count: Number(String(dupValue(first)) + current.slice(1)) });
    else tokens.push({ kind: isDif(first) ? "dif" : "value", text: current });
    current = "";
  };
  for (const c of line) {
    if (/[\d.,]/.test(c) && current !== "") current += c;
    else if (/[\d.,+-]/.test(c) || isSqz(c) || isDif(c) || isDup(c)) {
      flush();
      current = c;
    } else flush();
  }
  flush();
  return tokens;
}

/**
 * The value of an X written in plain AFFN ("4200", "-12.5"), with its decimals. An X in SQZ form is
 * not read: jcampconverter then takes the Y check value after a DIF line for a new point.
 */
function decodeX(text: string): { value: number; decimals: number } | undefined {
  const normal = text.replace(",", ".");
  if (!/^[+-]?(\d+\.?\d*|\.\d+)$/.test(normal)) return undefined;
  const dot = normal.indexOf(".");
  return { value: Number(normal), decimals: dot < 0 ? 0 : normal.length - dot - 1 };
}

/**
 * The X check values of the XYDATA block and the number of points its lines hold, or undefined
 * when the block is not in the (X++(Y..Y)) form or a line's X is not a plain number.
 */
export function readXCheckValues(text: string, xFactor: number): { checks: XCheckValue[]; pointCount: number } | undefined {
  const lines = text.split(/\r\n|\n|\r/);
  const start = lines.findIndex((line) => /^\s*##XYDATA\s*=\s*\(\s*X\s*\+\+\s*\(\s*Y\s*\.\.\s*Y\s*\)\s*\)/i.test(line));
  if (start < 0) return undefined;
  const checks: XCheckValue[] = [];
  let pointCount = 0;
  // After a line that ends in DIF form, the next line repeats its last Y as a check: that Y is no
  // new point, and the line's X belongs to the repeated point.
  let endedInDif = false;
  for (let i = start + 1; i < lines.length && !/^\s*##/.test(lines[i]); i++) {
    const tokens = tokenize(lines[i].replace(/\$\$.*/, ""));
    if (tokens.length === 0) continue;
    const [xToken, ...yTokens] = tokens;
    if (xToken.kind !== "value") return undefined;
    const x = decodeX(xToken.text);
    if (!x) return undefined;
    let pointIndex = pointCount;
    if (endedInDif && yTokens[0]?.kind === "value") {
      yTokens.shift();
      pointIndex = pointCount - 1;
      endedInDif = false;
    }
    checks.push({ line: i + 1, pointIndex, x: x.value * xFactor, halfDigit: 0.5 * 10 ** -x.decimals * Math.abs(xFactor) });
    for (const token of yTokens) {
      if (token.kind === "dup") pointCount += token.count - 1;
      else {
        pointCount++;
        endedInDif = token.kind === "dif";
      }
    }
  }
  return { checks, pointCount };
}
