// Which x scale a JCAMP-DX XYDATA block really has.
//
// The rule: FIRSTX, LASTX and NPOINTS define the abscissa; the X written at the start of each data
// line is, in the standard, only a check value. When NPOINTS equals the number of Y values the lines
// hold, the declared grid is consistent with the data, and line X values that disagree with it
// were written badly (rounded, truncated, or summed step by step in single precision by the
// exporter): the note says by how much, and the declared grid is kept. When NPOINTS does not match
// the data, the declared grid is the inconsistent one. If the line X values fall on one straight
// scale that runs from FIRSTX to LASTX over the points the lines hold, only NPOINTS was wrong and
// that scale is used; otherwise (a lost data line, a wrong FIRSTX or LASTX) no consistent scale
// exists and the file is refused.
import { shortNumber } from "./numberText.ts";
import { SpectrumFileError } from "./spectrumFileError.ts";
import { readXCheckValues, type XCheckValue } from "./jcampCheckValues.ts";

export interface DeclaredGrid {
  firstX: number;
  lastX: number;
  nPoints: number;
  xFactor: number;
}

/**
 * A check value farther from the grid than this is a disagreement: its own rounding, plus 10⁻⁷ of
 * x for FIRSTX and LASTX written to seven or eight significant digits.
 */
const tolerance = (check: XCheckValue) => check.halfDigit + 1e-7 * Math.abs(check.x);

function straightLine(checks: XCheckValue[]): { first: number; step: number } {
  const n = checks.length;
  const meanI = checks.reduce((s, c) => s + c.pointIndex, 0) / n;
  const meanX = checks.reduce((s, c) => s + c.x, 0) / n;
  let sii = 0;
  let six = 0;
  for (const c of checks) {
    sii += (c.pointIndex - meanI) ** 2;
    six += (c.pointIndex - meanI) * (c.x - meanX);
  }
  const step = six / sii;
  return { first: meanX - step * meanI, step };
}

const grid = (first: number, step: number, count: number) => Float64Array.from({ length: count }, (_, i) => first + i * step);

/** The x of each point, in the file's unit (`unitText` for the notes), and what was found. */
export function jcampAbscissa(
  fileName: string,
  text: string,
  declared: DeclaredGrid,
  pointCount: number,
  unitText: string,
): { x: Float64Array; notes: string[] } {
  const { firstX, lastX, nPoints, xFactor } = declared;
  const scan = readXCheckValues(text, xFactor);
  const readable = scan !== undefined && scan.pointCount === pointCount && scan.checks.length >= 2;

  if (pointCount !== nPoints) {
    const mismatch = `##NPOINTS=${nPoints} but the data lines hold ${pointCount} points`;
    if (readable) {
      const line = straightLine(scan.checks);
      const slack = Math.max(...scan.checks.map(tolerance));
      const straight = scan.checks.every((c) => Math.abs(c.x - (line.first + c.pointIndex * line.step)) <= tolerance(c));
      const fromFirstToLast = Math.abs(line.first - firstX) <= slack && Math.abs(line.first + (pointCount - 1) * line.step - lastX) <= slack;
      if (straight && fromFirstToLast) {
        return {
          x: grid(line.first, line.step, pointCount),
          notes: [
            `${mismatch}; the X values written at the start of the data lines fall on one straight scale from FIRSTX to LASTX over those points (${shortNumber(line.first)} ${unitText} + i · ${shortNumber(line.step)} ${unitText}), so NPOINTS was taken as wrong and that scale was used.`,
          ],
        };
      }
    }
    const why = !scan
      ? "the X values at the start of the data lines are not plain numbers"
      : !readable
        ? "the data lines could not be matched to points"
        : "the X values on the data lines do not run on one straight scale from FIRSTX to LASTX either (a data line may be missing)";
    throw new SpectrumFileError(`${fileName}: ${mismatch}, and ${why}, so the x values cannot be placed.`);
  }

  const step = nPoints > 1 ? (lastX - firstX) / (nPoints - 1) : 0;
  const x = grid(firstX, step, nPoints);
  if (!readable) {
    return {
      x,
      notes: ["The X values at the start of the data lines could not be read or matched to points, so they were not compared with FIRSTX, LASTX and NPOINTS."],
    };
  }
  const off = scan.checks.filter((c) => Math.abs(c.x - x[c.pointIndex]) > tolerance(c));
  if (off.length === 0) return { x, notes: [] };
  const worst = off.reduce((a, b) => (Math.abs(b.x - x[b.pointIndex]) > Math.abs(a.x - x[a.pointIndex]) ? b : a));
  const worstDifference = Math.abs(worst.x - x[worst.pointIndex]);
  return {
    x,
    notes: [
      `The X values at the start of ${off.length} of ${scan.checks.length} data lines disagree with the scale set by FIRSTX, LASTX and NPOINTS, by up to ${shortNumber(worstDifference)} ${unitText} (${shortNumber(worstDifference / Math.abs(step))} point spacings; line ${worst.line} says ${shortNumber(worst.x)} where the scale puts ${shortNumber(x[worst.pointIndex])}); the points were placed on the FIRSTX–LASTX scale, which agrees with the number of points, and the line values were taken as badly written.`,
    ],
  };
}
