import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { applyAffine } from "../geometry/affine";
import { NV24R_LAYOUT } from "./layout";
import { placeDie } from "./placement";
import { renderDieSvg } from "./render-svg";

describe("placeDie", () => {
  it("puts the die where hand arithmetic says (0.4 px/µm, 300 µm margin)", () => {
    // By hand: canvas (2400 + 600)·0.4 = 1200 by (1600 + 600)·0.4 = 880 px; die (0, 0) is the
    // lower-left corner, 300 µm in: (120, 880 − 120) = (120, 760); die (2400, 1600) → (1080, 120).
    const p = placeDie(NV24R_LAYOUT, { pxPerUm: 0.4, marginUm: 300 });
    expect([p.widthPx, p.heightPx]).toEqual([1200, 880]);
    expect(applyAffine(p.dieToImage, 0, 0)).toEqual([120, 760]);
    expect(applyAffine(p.dieToImage, 2400, 1600)).toEqual([1080, 120]);
  });

  it("turns, scales and shifts about the image centre", () => {
    // By hand: the die centre (1200, 800) sits at the canvas centre (600, 440) before the
    // extra move, so it lands at (600 + 7, 440 − 5). A 1 µm step along die x becomes
    // 0.4·1.02·(cos 1.5°, sin 1.5°) px in y-down image axes (clockwise on screen).
    const p = placeDie(NV24R_LAYOUT, { pxPerUm: 0.4, marginUm: 300, rotateDeg: 1.5, scale: 1.02, shiftPx: [7, -5] });
    const [cx, cy] = applyAffine(p.dieToImage, 1200, 800);
    expect(cx).toBeCloseTo(607, 9);
    expect(cy).toBeCloseTo(435, 9);
    const [ux, uy] = applyAffine(p.dieToImage, 1201, 800);
    const t = (1.5 * Math.PI) / 180;
    expect(ux - cx).toBeCloseTo(0.408 * Math.cos(t), 12);
    expect(uy - cy).toBeCloseTo(0.408 * Math.sin(t), 12);
    const back = applyAffine(p.imageToDie, cx, cy);
    expect(back[0]).toBeCloseTo(1200, 9);
    expect(back[1]).toBeCloseTo(800, 9);
  });
});

describe("renderDieSvg", () => {
  const options = { pxPerUm: 0.4, marginUm: 300 } as const;

  for (const look of ["bright_field", "dark_field"] as const) {
    it(`names every pad in the ${look.replace("_", " ")} SVG`, () => {
      const svg = renderDieSvg(NV24R_LAYOUT, { ...options, look });
      for (const pad of NV24R_LAYOUT.pads) expect(svg, pad.label).toContain(`<title>${pad.label}</title>`);
      for (const mark of NV24R_LAYOUT.textMarks) expect(svg).toContain(`>${mark.text}</text>`);
    });

    it(`produces a ${look.replace("_", " ")} SVG that librsvg parses at the placed size`, async () => {
      // Independent reference: librsvg (through sharp) must accept the document.
      const svg = renderDieSvg(NV24R_LAYOUT, { ...options, look });
      const meta = await sharp(Buffer.from(svg), { density: 72, limitInputPixels: 1200 * 880 }).metadata();
      expect([meta.format, meta.width, meta.height]).toEqual(["svg", 1200, 880]);
    });
  }
});
