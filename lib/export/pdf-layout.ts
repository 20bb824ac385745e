import fontkit from "@pdf-lib/fontkit";
import { PDFDocument, rgb, type PDFFont, type PDFPage } from "pdf-lib";
import { appFontBytes } from "@/lib/fonts/app-fonts";
import { wrapText } from "./wrap-text";

/**
 * A small flowing layout over pdf-lib: headings, paragraphs, tables that break across pages,
 * images scaled to the text width, and page numbers written once the page count is known.
 * Text is set in the app's own face (DejaVu Sans, regular and bold), embedded as subsets, so
 * µ, Ω, ±, ° and Greek print as typed; characters the face lacks become "?".
 */

export const A4: [number, number] = [595.28, 841.89];
const MARGIN = 50;
const LINE = 1.35;

/** Text as `font` can draw it on one line: line breaks become spaces, missing glyphs "?". */
function printable(text: string, font: PDFFont): string {
  const known = charactersOf(font);
  return [...text.replace(/[\t\r\n]+/g, " ")].map((c) => (known.has(c.codePointAt(0)!) ? c : "?")).join("");
}

const characterSets = new WeakMap<PDFFont, Set<number>>();
function charactersOf(font: PDFFont): Set<number> {
  let set = characterSets.get(font);
  if (!set) {
    set = new Set(font.getCharacterSet());
    characterSets.set(font, set);
  }
  return set;
}

export type Column = { readonly header: string; readonly width: number; readonly align?: "left" | "right" };

export class PdfWriter {
  page!: PDFPage;
  y = 0;
  private constructor(
    readonly doc: PDFDocument,
    readonly font: PDFFont,
    readonly bold: PDFFont,
  ) {}

  static async create(title: string): Promise<PdfWriter> {
    const doc = await PDFDocument.create();
    doc.registerFontkit(fontkit);
    doc.setTitle(title);
    doc.setCreator("Kerfline");
    doc.setProducer("Kerfline");
    const regular = await doc.embedFont(appFontBytes("regular"), { subset: true });
    const bold = await doc.embedFont(appFontBytes("bold"), { subset: true });
    const w = new PdfWriter(doc, regular, bold);
    w.newPage();
    return w;
  }

  get width(): number {
    return A4[0] - 2 * MARGIN;
  }

  /** Zero-based index of the current page. */
  get pageIndex(): number {
    return this.doc.getPageCount() - 1;
  }

  newPage(): void {
    this.page = this.doc.addPage(A4);
    this.y = A4[1] - MARGIN;
  }

  /** Starts a new page unless `height` points still fit above the bottom margin. */
  ensure(height: number): void {
    if (this.y - height < MARGIN + 20) this.newPage();
  }

  /** Lines of at most `width` at this size: word wrap, line breaks kept, long words broken. */
  wrap(text: string, size: number, font = this.font, width = this.width): string[] {
    const clean = text
      .split(/\r?\n/)
      .map((p) => printable(p, font))
      .join("\n");
    return wrapText(clean, width, (t) => font.widthOfTextAtSize(t, size));
  }

  /** A paragraph that flows onto the next page when it reaches the bottom margin. */
  text(text: string, size = 10, opts: { bold?: boolean; gap?: number; indent?: number; grey?: boolean } = {}): void {
    const font = opts.bold ? this.bold : this.font;
    const indent = opts.indent ?? 0;
    const color = opts.grey ? rgb(0.35, 0.35, 0.4) : rgb(0.1, 0.1, 0.12);
    for (const line of this.wrap(text, size, font, this.width - indent)) {
      this.ensure(size * LINE);
      this.y -= size * LINE;
      if (line) this.page.drawText(line, { x: MARGIN + indent, y: this.y, size, font, color });
    }
    this.y -= opts.gap ?? size * 0.4;
  }

  /** A section heading, kept on the same page as at least a few lines of what follows. */
  heading(text: string, size = 14, keep = size * 5): void {
    this.ensure(keep);
    this.y -= size * 0.5;
    this.text(text, size, { bold: true, gap: size * 0.35 });
  }

  /** Label/value pairs in two columns; long values wrap and flow across pages. */
  facts(rows: readonly (readonly [string, string])[], size = 10, labelWidth = 150): void {
    for (const [k, v] of rows) {
      const lines = this.wrap(v || "—", size, this.font, this.width - labelWidth);
      lines.forEach((l, i) => {
        this.ensure(size * LINE);
        this.y -= size * LINE;
        if (i === 0) this.page.drawText(printable(k, this.bold), { x: MARGIN, y: this.y, size, font: this.bold });
        if (l) this.page.drawText(l, { x: MARGIN + labelWidth, y: this.y, size, font: this.font });
      });
      this.y -= 2;
    }
    this.y -= size * 0.6;
  }

  /** Keeps `height` points of the current page for something drawn later (a contents list). */
  reserve(height: number): { page: PDFPage; y: number } {
    this.ensure(height);
    const at = { page: this.page, y: this.y };
    this.y -= height;
    return at;
  }

  private drawCells(lines: readonly string[], columns: readonly Column[], size: number, font: PDFFont): void {
    let x = MARGIN;
    columns.forEach((c, i) => {
      const cell = lines[i] ?? "";
      if (cell) {
        const w = font.widthOfTextAtSize(cell, size);
        this.page.drawText(cell, { x: c.align === "right" ? x + c.width - 4 - w : x, y: this.y, size, font });
      }
      x += c.width;
    });
  }

  /**
   * A table whose cells wrap (nothing is cut) and whose header repeats on every page it runs
   * onto; a row taller than what is left of the page continues on the next one.
   */
  table(columns: readonly Column[], rows: readonly (readonly string[])[], size = 8.5): void {
    const lineHeight = size * LINE;
    const header = () => {
      const cells = columns.map((c) => this.wrap(c.header, size, this.bold, c.width - 4));
      for (let i = 0; i < Math.max(...cells.map((c) => c.length)); i++) {
        this.y -= lineHeight;
        this.drawCells(
          cells.map((c) => c[i] ?? ""),
          columns,
          size,
          this.bold,
        );
      }
      this.y -= 2;
      this.page.drawLine({ start: { x: MARGIN, y: this.y }, end: { x: MARGIN + this.width, y: this.y }, thickness: 0.5, color: rgb(0.5, 0.5, 0.5) });
    };
    this.ensure(lineHeight * 3);
    header();
    for (const r of rows) {
      const cells = columns.map((c, i) => this.wrap(r[i] ?? "", size, this.font, c.width - 4));
      const height = Math.max(...cells.map((c) => c.length));
      for (let i = 0; i < height; i++) {
        const before = this.pageIndex;
        // A short row moves whole to the next page; a long one breaks between its lines.
        this.ensure(i === 0 && height <= 4 ? lineHeight * height + 2 : lineHeight + 2);
        if (this.pageIndex !== before) header();
        this.y -= lineHeight;
        this.drawCells(
          cells.map((c) => c[i] ?? ""),
          columns,
          size,
          this.font,
        );
      }
      this.y -= 2;
    }
    this.y -= size;
  }

  /** A PNG scaled to fit the text width and at most `maxHeight` points tall, kept on one page with its caption. */
  async image(png: Uint8Array, maxHeight = A4[1] - 2 * MARGIN - 60, caption?: string, minHeight = maxHeight): Promise<void> {
    const img = await this.doc.embedPng(png);
    const captionSize = 8.5;
    const captionHeight = caption ? this.wrap(caption, captionSize).length * captionSize * LINE + 4 : 0;
    // Shrunk to what is left of the page when that still leaves it `minHeight` tall.
    const room = this.y - (MARGIN + 20) - 6 - captionHeight;
    const fit = Math.min(maxHeight, img.height * (this.width / img.width));
    const height = fit > room && room >= minHeight ? room : maxHeight;
    const scale = Math.min(this.width / img.width, height / img.height);
    const w = img.width * scale;
    const h = img.height * scale;
    this.ensure(h + 6 + captionHeight);
    this.y -= h;
    this.page.drawImage(img, { x: MARGIN, y: this.y, width: w, height: h });
    this.y -= 4;
    if (caption) this.text(caption, captionSize, { grey: true });
    this.y -= 4;
  }

  /** "Page n of N" at the foot of every page; call last. */
  numberPages(footer: string): void {
    const pages = this.doc.getPages();
    pages.forEach((p, i) => {
      const label = printable(`${footer} · page ${i + 1} of ${pages.length}`, this.font);
      const w = this.font.widthOfTextAtSize(label, 8);
      p.drawText(label, { x: A4[0] - MARGIN - w, y: MARGIN / 2, size: 8, font: this.font, color: rgb(0.4, 0.4, 0.45) });
    });
  }
}
