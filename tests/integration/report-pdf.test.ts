import { beforeAll, describe, expect, inject, it } from "vitest";
import sharp from "sharp";
import { PDFDocument } from "pdf-lib";
import * as pdfjsDist from "pdfjs-dist/legacy/build/pdf.mjs";
import { demoWorld, EVERYONE, freshCase, type Who } from "./fixtures";
import { uploadForm } from "../support/images";
import { waitForStatus } from "../support/micrographs";
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

// The PDF die report over HTTP: any member downloads it, outsiders get 404; the file opened by
// an independent PDF parser (pdfjs-dist) holds the title, the pad labels and
// decodable images.
let world: Awaited<ReturnType<typeof demoWorld>>;
let dieId: string;

const rect = (x0: number, y0: number, w: number, h: number) => ({
  type: "Polygon",
  coordinates: [
    [
      [x0, y0],
      [x0 + w, y0],
      [x0 + w, y0 + h],
      [x0, y0 + h],
      [x0, y0],
    ],
  ],
});
const LABELS = ["VREF", "GND", "OUTA", "VCC"];
// Longer than any table cell, so a layout that cuts cells shows it.
const LONG_REMARK =
  "The bandgap core looks re-drawn: " + Array.from({ length: 40 }, (_, i) => `detail${i}`).join(" ") + " please compare with the dark-field frame.";
const REPLY = "Reply: the trim fuses F2 and F3 are open, photographed at 50x; nothing else differs.";
const SAVED = {
  kind: "bond-wire",
  formula: "Bond-wire inductance (Rosa; Grover)",
  source: "Grover 1946",
  lengthUm: 1000,
  diameterUm: 25,
  inductanceNh: 1.024,
  savedAt: "2026-12-01T10:00:00.000Z",
};

beforeAll(async () => {
  world = await demoWorld();
  ({ dieId } = await freshCase(world.clients.owner, world.teamId, "Report case"));
  const png = await sharp({ create: { width: 500, height: 400, channels: 3, background: { r: 120, g: 130, b: 90 } } })
    .png()
    .toBuffer();
  const up = await world.clients.analyst.upload<{ id: string }>(
    `/api/dies/${dieId}/micrographs`,
    uploadForm(png, "bf.png", { label: "bright field 5x", scaleUmPerPx: "2" }),
  );
  expect(up.status).toBe(202);
  await waitForStatus(world.clients.analyst, up.body.id, "ready");
  const shapes = [
    { kind: "pad", geometry: rect(20, 600, 60, 60), properties: { label: LABELS[0], state: "bonded" } },
    { kind: "pad", geometry: rect(20, 200, 60, 60), properties: { label: LABELS[1], state: "bonded" } },
    { kind: "pad", geometry: rect(920, 200, 60, 60), properties: { label: LABELS[2], state: "probed" } },
    { kind: "pad", geometry: rect(920, 600, 60, 60), properties: { label: LABELS[3], state: "unbonded" } },
    { kind: "block", geometry: rect(300, 300, 300, 200), properties: { name: "bandgap", function: "voltage reference" } },
    {
      kind: "ruler",
      geometry: {
        type: "LineString",
        coordinates: [
          [0, 100],
          [1000, 100],
        ],
      },
      properties: { label: "die width" },
    },
    {
      kind: "wire_bond",
      geometry: {
        type: "LineString",
        coordinates: [
          [50, 630],
          [-200, 630],
        ],
      },
      properties: { label: "BW1", estimates: { "bond-wire": SAVED } },
    },
  ];
  expect((await world.clients.analyst.request("POST", `/api/dies/${dieId}/markup`, shapes)).status).toBe(201);
  // Check: one open remark, one closed, and the die sent to the checker.
  const open = await world.clients.reviewer.request<{ id: string }>("POST", `/api/dies/${dieId}/threads`, {
    region: rect(400, 400, 50, 50),
    body: "Is the bandgap trimmed? Ω ± 5 %",
  });
  expect(open.status).toBe(201);
  const closed = await world.clients.reviewer.request<{ id: string }>("POST", `/api/dies/${dieId}/threads`, {
    region: rect(100, 100, 50, 50),
    body: "Pad pitch checked",
  });
  expect((await world.clients.analyst.request("POST", `/api/threads/${open.body.id}/comments`, { body: REPLY })).status).toBe(201);
  expect((await world.clients.reviewer.request("POST", `/api/dies/${dieId}/threads`, { region: rect(600, 300, 50, 50), body: LONG_REMARK })).status).toBe(201);
  expect((await world.clients.reviewer.request("POST", `/api/threads/${closed.body.id}/resolve`, {})).status).toBe(200);
  expect((await world.clients.analyst.request("POST", `/api/dies/${dieId}/review`, { action: "send", message: "ready for a look" })).status).toBe(200);
});

async function fetchPdf(who: Who) {
  const cookie = (world.clients[who] as unknown as { cookieHeader(): string }).cookieHeader();
  const res = await fetch(`${inject("baseUrl")}/api/dies/${dieId}/report.pdf`, { headers: { cookie } });
  return { res, body: new Uint8Array(await res.arrayBuffer()) };
}

type PdfJs = {
  getDocument: (src: { data: Uint8Array; useSystemFonts?: boolean }) => { promise: Promise<PdfDoc> };
  OPS: Record<string, number>;
};
type PdfDoc = { numPages: number; getMetadata: () => Promise<{ info: Record<string, unknown> }>; getPage: (n: number) => Promise<PdfPage> };
type PdfPage = {
  getTextContent: () => Promise<{ items: { str?: string }[] }>;
  getOperatorList: () => Promise<{ fnArray: number[]; argsArray: unknown[][] }>;
  objs: { get: (id: string, cb: (img: { width: number; height: number }) => void) => void };
  commonObjs: { get: (id: string) => { name: string; missingFile: boolean } };
};
// A static import: a missing or broken pdfjs-dist fails the file instead of skipping the checks.
const pdfjs = pdfjsDist as unknown as PdfJs;

describe("PDF die report", () => {
  it("downloads as a PDF whose pages pdf-lib can read back", async () => {
    const { res, body } = await fetchPdf("viewer");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("content-disposition")).toMatch(/filename="Report-case-die-1-report-\d{4}-\d{2}-\d{2}\.pdf"/);
    // ISO 32000-1 §7.5.2: a PDF file starts with the header %PDF-1.n.
    expect(Buffer.from(body.subarray(0, 5)).toString("latin1")).toBe("%PDF-");
    const doc = await PDFDocument.load(body);
    // The sections flow one after another: this little die fits on a few pages (it took eight
    // when each section started a page of its own).
    expect(doc.getPageCount()).toBeLessThanOrEqual(4);
    expect(doc.getTitle()).toBe("Die report: Report case — die 1");
  });

  // poppler's pdftotext is an independent reader of the text the pages draw.
  it("prints every remark, reply and saved estimate in full, read back by pdftotext", async () => {
    const { body } = await fetchPdf("viewer");
    const dir = mkdtempSync(join(tmpdir(), "report-"));
    let text: string;
    try {
      writeFileSync(join(dir, "r.pdf"), body);
      text = execFileSync("pdftotext", ["-enc", "UTF-8", join(dir, "r.pdf"), "-"], { encoding: "utf8" });
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
    // pdftotext puts each page's running footer between the lines a page break splits; drop
    // those footers so a remark that runs over to the next page reads as one text.
    const flat = text
      .split("\n")
      .filter((line) => !/ · page \d+ of \d+$/.test(line.trim()))
      .join("\n")
      .split(/\s+/)
      .filter(Boolean)
      .join(" ");
    for (const m of [LONG_REMARK, REPLY, "Is the bandgap trimmed? Ω ± 5 %", "Pad pitch checked", "ready for a look"]) expect(flat).toContain(m);
    expect(text).not.toContain("…");
    // The reply under its author and full date and time.
    expect(flat).toMatch(new RegExp(`, \\d{4}-\\d{2}-\\d{2} \\d{2}:\\d{2} ${REPLY.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}`));
    expect(flat).toContain("Bond-wire inductance (Rosa; Grover) — L 1.02 nH");
    expect(flat).toContain("length (µm) 1000 · diameter (µm) 25 · inductance (nH) 1.024");
  });

  // pdfjs-dist is an independent PDF reader.
  it("holds the title, page count, pad labels and decodable images for an independent PDF parser", async () => {
    const { body } = await fetchPdf("owner");
    const doc = await pdfjs.getDocument({ data: body, useSystemFonts: false }).promise;
    const meta = await doc.getMetadata();
    expect(meta.info.Title).toBe("Die report: Report case — die 1");
    const texts: string[] = [];
    let images = 0;
    for (let n = 1; n <= doc.numPages; n++) {
      const page = await doc.getPage(n);
      texts.push((await page.getTextContent()).items.map((i) => i.str ?? "").join(" "));
      const ops = await page.getOperatorList();
      for (let i = 0; i < ops.fnArray.length; i++) {
        if (ops.fnArray[i] !== pdfjs.OPS.paintImageXObject) continue;
        const img = await new Promise<{ width: number; height: number }>((resolve) => page.objs.get(ops.argsArray[i][0] as string, resolve));
        expect(img.width).toBeGreaterThan(0);
        images++;
      }
    }
    const all = texts.join("\n");
    for (const label of LABELS) expect(all).toContain(label);
    expect(all).toContain(`page ${doc.numPages} of ${doc.numPages}`);
    expect(all).toContain("Contents");
    expect(images).toBeGreaterThanOrEqual(1);
    // Check history and the remarks, with symbols outside Latin-1 kept as typed.
    expect(all).toContain("ready for a look");
    expect(all).toContain("Is the bandgap trimmed? Ω ± 5 %");
    expect(all).toContain("Pad pitch checked");
    expect(all).toMatch(/closed by /);
    expect(all).not.toMatch(/\bresolved\b/i);
    expect(all).toContain("Revision 1 · with checker, not signed off");
    expect(all).toMatch(/[µμ]m/); // pdfjs reports MICRO SIGN as its compatibility form, GREEK MU
  });

  it("embeds the app's own typeface in every font it uses", async () => {
    const { body } = await fetchPdf("owner");
    const doc = await pdfjs.getDocument({ data: body, useSystemFonts: false }).promise;
    const fonts = new Map<string, { name: string; missingFile: boolean }>();
    for (let n = 1; n <= doc.numPages; n++) {
      const page = await doc.getPage(n);
      const ops = await page.getOperatorList();
      for (let i = 0; i < ops.fnArray.length; i++) {
        if (ops.fnArray[i] !== pdfjs.OPS.setFont) continue;
        const id = ops.argsArray[i][0] as string;
        fonts.set(id, page.commonObjs.get(id));
      }
    }
    expect(fonts.size).toBeGreaterThanOrEqual(2); // regular and bold
    for (const f of fonts.values()) {
      expect(f.name).toMatch(/DejaVuSans/);
      expect(f.missingFile).toBe(false);
    }
  });

  for (const who of EVERYONE) {
    const status = who === "anonymous" ? 401 : who === "outsider" ? 404 : 200;
    it(`answers ${status} for ${who}`, async () => {
      expect((await fetchPdf(who)).res.status).toBe(status);
    });
  }
});
