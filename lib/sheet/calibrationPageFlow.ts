type Doc = PDFKit.PDFDocument;

/**
 * Where the next block of the report goes. Blocks are measured before they are drawn, and a block
 * that does not fit below the cursor starts a new page (which opens with the caution reminder),
 * so nothing is drawn over the footer and no block is cut in half.
 */
export class CalibrationPageFlow {
  y: number;

  constructor(
    readonly doc: Doc,
    readonly x: number,
    readonly width: number,
    readonly top: number,
    /** Lowest y any block may reach: the footer sits below it. */
    readonly bottom: number,
    private readonly openPage: (doc: Doc, x: number, y: number, width: number) => number,
  ) {
    this.y = top;
  }

  newPage(): void {
    this.doc.addPage();
    this.y = this.openPage(this.doc, this.x, this.top, this.width);
  }

  /** Makes room for a block `height` tall; returns true when that took a new page. */
  ensure(height: number): boolean {
    if (this.y + height <= this.bottom) return false;
    this.newPage();
    return true;
  }

  /** Space left on this page below the cursor. */
  get room(): number {
    return this.bottom - this.y;
  }
}
