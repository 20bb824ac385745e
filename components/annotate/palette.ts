// The markup palette lives in lib/ so the server-side export renderer draws the same colours.
export { KIND_STYLE, PAD_STATE_STYLE, SELECTION_COLOUR, HALO_COLOUR } from "@/lib/markup/palette";
