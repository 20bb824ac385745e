import fontkit from "@pdf-lib/fontkit";
import { PDFDocument, rgb, type PDFFont, type PDFPage } from "pdf-lib";
import { appFontBytes } from "@/lib/fonts/app-fonts";

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
export function printable(text: string, font: PDFFont): string {
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
    doc.setProducer("Kerfline (pdf-lib)");
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

  /** Lines of at most the text width at this size (greedy word wrap). */
  wrap(text: string, size: number, font = this.font, width = this.width): string[] {
    const words = printable(text, font).split(" ");
    const lines: string[] = [];
    let line = "";
    for (const word of words) {
      const next = line ? `${line} ${word}` : word;
      if (font.widthOfTextAtSize(next, size) <= width || !line) line = next;
      else {
        lines.push(line);
        line = word;
      }
    }
    if (line) lines.push(line);
    return lines;
  }

  text(text: string, size = 10, opts: { bold?: boolean; gap?: number } = {}): void {
    const font = opts.bold ? this.bold : this.font;
    for (const line of this.wrap(text, size, font)) {
      this.ensure(size * LINE);
      this.y -= size * LINE;
      this.page.drawText(line, { x: MARGIN, y: this.y, size, font, color: rgb(0.1, 0.1, 0.12) });
    }
    this.y -= opts.gap ?? size * 0.4;
  }

  heading(text: string, size = 16): void {
    this.ensure(size * 3);
    this.y -= size * 0.6;
    this.text(text, size, { bold: true, gap: size * 0.5 });
  }

  /** Label/value pairs in two columns. */
  facts(rows: readonly (readonly [string, string])[], size = 10): void {
    for (const [k, v] of rows) {
      const lines = this.wrap(v || "—", size, this.font, this.width - 150);
      this.ensure(size * LINE * lines.length);
      this.page.drawText(printable(k, this.bold), { x: MARGIN, y: this.y - size * LINE, size, font: this.bold });
      lines.forEach((l, i) => this.page.drawText(l, { x: MARGIN + 150, y: this.y - size * LINE * (i + 1), size, font: this.font }));
      this.y -= size * LINE * lines.length + 2;
    }
    this.y -= size * 0.6;
  }

  private row(cells: readonly string[], columns: readonly Column[], size: number, font: PDFFont): void {
    this.ensure(size * LINE + 2);
    this.y -= size * LINE;
    let x = MARGIN;
    columns.forEach((c, i) => {
      let cell = printable(cells[i] ?? "", font);
      while (cell.length > 1 && font.widthOfTextAtSize(cell, size) > c.width - 4) cell = `${cell.slice(0, -2)}…`;
      const w = font.widthOfTextAtSize(cell, size);
      this.page.drawText(cell, { x: c.align === "right" ? x + c.width - 4 - w : x, y: this.y, size, font });
      x += c.width;
    });
    this.y -= 2;
  }

  /** A table whose header repeats on every page it runs onto. */
  table(columns: readonly Column[], rows: readonly (readonly string[])[], size = 8.5): void {
    const header = () => {
      this.row(columns.map((c) => c.header), columns, size, this.bold);
      this.page.drawLine({ start: { x: MARGIN, y: this.y }, end: { x: MARGIN + this.width, y: this.y }, thickness: 0.5, color: rgb(0.5, 0.5, 0.5) });
    };
    header();
    for (const r of rows) {
      const before = this.pageIndex;
      this.ensure(size * LINE + 2);
      if (this.pageIndex !== before) header();
      this.row(r, columns, size, this.font);
    }
    this.y -= size;
  }

  /** A PNG scaled to fit the text width and at most `maxHeight` points tall. */
  async image(png: Uint8Array, maxHeight = A4[1] - 2 * MARGIN - 60): Promise<void> {
    const img = await this.doc.embedPng(png);
    const scale = Math.min(this.width / img.width, maxHeight / img.height);
    const w = img.width * scale;
    const h = img.height * scale;
    this.ensure(h + 6);
    this.y -= h;
    this.page.drawImage(img, { x: MARGIN, y: this.y, width: w, height: h });
    this.y -= 8;
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
