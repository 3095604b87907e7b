import PDFDocument from "pdfkit";
import { paperSizes, type PaperName } from "./paper.ts";
import { sheetFont } from "./sheetFonts.ts";
import { buildDate, type SheetBuildIdentity } from "./sheetInput.ts";
import { sheetFonts } from "./sheetStyle.ts";

/**
 * A PDF document of the project's printed outputs (bench sheets, calibration reports): pages
 * added by the caller, buffered for page numbers, the embedded regular and bold fonts. The
 * build's date stands for the creation date: PDFKit's file ID is an MD5 of the info dictionary
 * and the font subset tags follow the order of use, so equal inputs give equal bytes.
 */
export function newPdfDocument(paper: PaperName, build: SheetBuildIdentity, info: { title: string; subject: string }): PDFKit.PDFDocument {
  const size = paperSizes[paper];
  const date = buildDate(build);
  const doc = new PDFDocument({
    size: [size.widthPt, size.heightPt],
    margin: 0,
    autoFirstPage: false,
    bufferPages: true,
    displayTitle: true,
    lang: "en",
    info: {
      Title: info.title,
      Subject: info.subject,
      Creator: `bandatlas ${build.version} (${build.commit})`,
      Producer: "bandatlas with PDFKit",
      CreationDate: date,
      ModDate: date,
    },
  });
  doc.registerFont(sheetFonts.regular, sheetFont("regular") as Buffer);
  doc.registerFont(sheetFonts.bold, sheetFont("bold") as Buffer);
  return doc;
}

/** Lays the document out and collects its bytes. */
export function pdfBytes(doc: PDFKit.PDFDocument, lay: () => void): Promise<Buffer> {
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("data", (chunk: Buffer) => chunks.push(chunk));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });
  lay();
  doc.end();
  return done;
}
