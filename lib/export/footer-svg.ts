import { niceScaleBarLength, type ScaleBar } from "@/lib/geometry/scale-bar";
import { KIND_STYLE } from "@/lib/markup/palette";
import type { MarkupKind } from "@/lib/markup/types";
import { clip, n2, xmlEscape } from "./svg-text";

/** What the title block states about the export. */
export type TitleBlock = {
  readonly caseTitle: string;
  readonly dieName: string;
  readonly micrograph: string;
  readonly illumination: string;
  readonly umPerPx: number;
  readonly date: string;
  readonly author: string;
  /** The revision and its sign-off, as `revisionStatement` words it. */
  readonly revision: string;
};

const FOOTER_BACKGROUND = "#15191d";
/** The bar is pure white on the dark footer, so tests (and readers) can find it exactly. */
const SCALE_BAR_COLOUR = "#ffffff";

/** Where the scale bar was drawn, in output pixels of the whole image (footer included). */
export type PlacedScaleBar = ScaleBar & { readonly x: number; readonly y: number; readonly thickness: number };

export type Footer = { readonly svg: string; readonly height: number; readonly scaleBar: PlacedScaleBar };

/** The footer's height for an output this wide: room for four lines of the title block. */
function footerHeight(width: number): number {
  return Math.round(Math.max(110, Math.min(900, width * 0.075)));
}

/** A short µm/px figure for the title block. */
export function formatScale(umPerPx: number): string {
  return `${umPerPx.toPrecision(3)} µm/px`;
}

function titleLines(t: TitleBlock, maxChars: number): string[] {
  const lines = [
    `${clip(t.caseTitle, 60)} · ${clip(t.dieName, 40)}`,
    `${clip(t.micrograph, 50)} (${t.illumination}) · ${formatScale(t.umPerPx)}`,
    `${t.date} · exported by ${clip(t.author, 40)}`,
    t.revision,
  ];
  return lines.map((l) => clip(l, maxChars));
}

function legendSvg(kinds: readonly MarkupKind[], x: number, y: number, font: number): string {
  return kinds
    .map((k, i) => {
      const col = i % 2;
      const row = Math.floor(i / 2);
      const cx = x + col * font * 9;
      const cy = y + row * font * 1.5;
      return `<rect x="${n2(cx)}" y="${n2(cy - font * 0.8)}" width="${n2(font)}" height="${n2(font * 0.8)}" fill="${KIND_STYLE[k].colour}"/><text x="${n2(cx + font * 1.4)}" y="${n2(cy)}" font-size="${n2(font)}" fill="#e6e9ec">${xmlEscape(KIND_STYLE[k].label)}</text>`;
    })
    .join("");
}

/**
 * The band below the image: title block on the left, legend of the kinds shown in the middle,
 * and a scale bar of a round length (1-2-5 series) on the right, at most a fifth of the width.
 * @param top the footer's top edge in output pixels (the image's height)
 */
export function footerSvg(width: number, top: number, umPerPx: number, title: TitleBlock, kinds: readonly MarkupKind[]): Footer {
  const height = footerHeight(width);
  const font = height / 7;
  const pad = font;
  // Average glyph width is about 0.55 em in a sans-serif face; the title keeps to 45 % of the width.
  const lines = titleLines(title, Math.max(12, Math.floor((width * 0.45 - pad) / (font * 0.6))))
    .map(
      (l, i) =>
        `<text x="${n2(pad)}" y="${n2(top + pad + font * (1.2 + i * 1.5))}" font-size="${n2(i === 0 ? font * 1.15 : font)}" fill="#e6e9ec"${i === 0 ? ' font-weight="bold"' : ""}>${xmlEscape(l)}</text>`,
    )
    .join("");
  const bar = niceScaleBarLength(umPerPx, width * 0.2);
  const thickness = Math.max(3, Math.round(font * 0.45));
  const barX = Math.round(width - pad - bar.px);
  const barY = Math.round(top + height - pad - thickness);
  const barLength = Math.round(bar.px);
  const scale = `<rect x="${barX}" y="${barY}" width="${barLength}" height="${thickness}" fill="${SCALE_BAR_COLOUR}" shape-rendering="crispEdges"/><text x="${n2(barX + barLength / 2)}" y="${n2(barY - font * 0.5)}" font-size="${n2(font * 1.1)}" text-anchor="middle" fill="#ffffff">${xmlEscape(bar.label)}</text>`;
  const legend = legendSvg(kinds, width * 0.47, top + pad + font * 1.2, font * 0.9);
  const svg = `<rect x="0" y="${top}" width="${width}" height="${height}" fill="${FOOTER_BACKGROUND}"/>${lines}${legend}${scale}`;
  return { svg, height, scaleBar: { ...bar, x: barX, y: barY, thickness } };
}
