/**
 * Width of the die bench's side panel: kept between a floor that fits its forms and a ceiling
 * that leaves the micrograph most of the window, and remembered in localStorage.
 */
export const PANEL_WIDTH_KEY = "kerfline.side-panel-width";
export const DEFAULT_PANEL_WIDTH = 384;
export const MIN_PANEL_WIDTH = 320;
/** The panel never takes more than this share of the window, nor more than MAX_PANEL_WIDTH. */
const MAX_PANEL_SHARE = 0.7;
const MAX_PANEL_WIDTH = 1100;

/** The width clamped to what the window allows; anything unreadable becomes the default. */
export function clampPanelWidth(width: number, windowWidth: number): number {
  if (!Number.isFinite(width)) return DEFAULT_PANEL_WIDTH;
  const max = Math.max(MIN_PANEL_WIDTH, Math.min(MAX_PANEL_WIDTH, Math.floor(windowWidth * MAX_PANEL_SHARE)));
  return Math.round(Math.min(max, Math.max(MIN_PANEL_WIDTH, width)));
}

/** The stored width (a whole number of px), or null when nothing usable is stored. */
export function parseStoredWidth(raw: string | null): number | null {
  if (raw === null || !/^\d{2,5}$/.test(raw.trim())) return null;
  return Number(raw.trim());
}
