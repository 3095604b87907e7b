import { bandOriginBound, type AtlasBand, type AtlasEntry } from "../atlas/index.ts";
import { bandLabel } from "../core/index.ts";
import { accuracyText, bandOriginBoundNote, bandOriginText, calibrationCellText, calibrationLineKey, fixed, intensityOriginWords, lineColumn, lineColumns, significant, type LineCalibration } from "../format/index.ts";
import { downloadPath, lineRowId } from "../shared/sitePaths.ts";
import { signedSignificant } from "./formatCells.ts";

const bandTitles: Record<AtlasBand["kind"], string> = { fundamental: "fundamental", hot: "hot band", overtone: "overtone", combination: "combination band" };

function intensityNote(band: AtlasBand): string {
  const origin = band.lines.intensityOrigin;
  if (origin === null) return "No absolute intensities: the molecule file cites no band strength or transition dipole for this band.";
  return `Absolute intensities ${intensityOriginWords[origin]}, per molecule of the gas at natural isotopic abundance.`;
}

function truncationNote(band: AtlasBand): string {
  const why = { intensity: "weaker lines fall below 10⁻⁴ of the strongest", "constants-turn-over": "the constants stop being valid (the rotational levels turn over)", "j-limit": "the program's J limit is reached" }[band.lines.truncatedBy];
  return `Lines up to J'' = ${band.lines.jLowerMax}; the list stops there because ${why}.`;
}

/** The line columns the species pages show (headings and units from lib/format). */
const pageColumns = lineColumns.filter((c) => c.page !== null);
export const pageLineHeadings = pageColumns.map((c) => c.page!);

export function bandView(entry: AtlasEntry, band: AtlasBand, calibration?: Map<string, LineCalibration[]>) {
  const residualByLabel = new Map<string, number>();
  for (const r of entry.residuals) {
    if (r.predictedMinusMeasured === null) continue;
    if (bandLabel(r.reference.band) !== band.label) continue;
    residualByLabel.set(r.reference.label, r.predictedMinusMeasured);
  }
  const calibrationOf = (label: string) => {
    const list = calibration?.get(calibrationLineKey(entry.species, band.label, label));
    return list ? calibrationCellText(list) : null;
  };
  const rows = band.lines.lines.map((line) => {
    const residual = residualByLabel.get(line.label);
    return {
      id: lineRowId(band.label, line.label),
      label: line.label,
      branch: line.branch,
      // The page's line columns, in the order and digits of lib/format lineColumns.
      cells: pageColumns.map((c) => c.cell(line) || "—"),
      wavenumber: lineColumn("wavenumber").cell(line),
      // One sign everywhere (residualSignText): the atlas's prediction minus the measured line.
      predictedMinusMeasured: residual === undefined ? null : signedSignificant(residual, 2),
      calibration: calibrationOf(line.label),
    };
  });
  return {
    label: band.label,
    kind: band.kind,
    title: `${band.label}${band.name !== band.label ? ` (${band.name})` : ""} ${bandTitles[band.kind]}`,
    anchor: `band-${band.label}`,
    bandOrigin: bandOriginText(bandOriginBound(band.lines)),
    bandOriginNote: bandOriginBoundNote,
    lineCount: band.lines.lines.length,
    strength: band.kind === "fundamental" || band.strengthRelativeToFundamental === null ? null : significant(band.strengthRelativeToFundamental, 2),
    shownWithFundamental: band.shownWithFundamental,
    intensityNote: intensityNote(band),
    accuracy: accuracyText(band.lines.accuracy),
    accuracyStatus: band.lines.accuracy.status,
    truncationNote: truncationNote(band),
    hasResiduals: residualByLabel.size > 0,
    downloads: {
      csv: downloadPath(entry.moleculeId, entry.species, entry.temperatureK, band.label, "csv"),
      json: downloadPath(entry.moleculeId, entry.species, entry.temperatureK, band.label, "json"),
    },
    hasCalibration: rows.some((r) => r.calibration !== null),
    headings: pageLineHeadings,
    rows,
  };
}

