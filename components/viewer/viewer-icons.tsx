import type { SVGProps } from "react";

// Drawn for Kerfline on a 16-unit grid with 1.5-unit strokes in the current text colour.
function Icon(props: SVGProps<SVGSVGElement>) {
  return (
    <svg viewBox="0 0 16 16" width="16" height="16" fill="none" stroke="currentColor" strokeWidth="1.5" strokeLinecap="round" aria-hidden="true" {...props} />
  );
}

/** A plus sign. */
export function ZoomInIcon() {
  return (
    <Icon>
      <path d="M8 3.5v9M3.5 8h9" />
    </Icon>
  );
}

/** A minus sign. */
export function ZoomOutIcon() {
  return (
    <Icon>
      <path d="M3.5 8h9" />
    </Icon>
  );
}

/** A die outline with a bond pad on each edge: "show the whole die". */
export function FitDieIcon() {
  return (
    <Icon>
      <rect x="4" y="4" width="8" height="8" rx="0.5" />
      <path d="M8 1.5v2M8 12.5v2M1.5 8h2M12.5 8h2" />
    </Icon>
  );
}

/** Four corners pushed outwards. */
export function FullScreenIcon({ exit = false }: { exit?: boolean }) {
  const d = exit ? "M6 2.5V6H2.5M10 2.5V6h3.5M6 13.5V10H2.5M10 13.5V10h3.5" : "M2.5 6V2.5H6M13.5 6V2.5H10M2.5 10v3.5H6M13.5 10v3.5H10";
  return (
    <Icon>
      <path d={d} strokeLinejoin="round" />
    </Icon>
  );
}

/** A coarse pixel grid with two filled cells: "show pixels as squares". */
export function PixelsIcon() {
  return (
    <Icon strokeWidth="1">
      <path d="M2.5 2.5h11v11h-11zM6.17 2.5v11M9.83 2.5v11M2.5 6.17h11M2.5 9.83h11" />
      <rect x="2.5" y="2.5" width="3.67" height="3.67" fill="currentColor" stroke="none" />
      <rect x="6.17" y="6.17" width="3.67" height="3.67" fill="currentColor" stroke="none" />
    </Icon>
  );
}
