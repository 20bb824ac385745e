// Pure helpers of the mosaic upload dialog: the order files are listed in and the progress of each.

const collator = new Intl.Collator(undefined, { numeric: true, sensitivity: "base" });

/** Files in natural order of their names (IMG_2 before IMG_10), as cameras number frames. */
export function naturalOrder<T extends { name: string }>(files: readonly T[]): T[] {
  return [...files].sort((a, b) => collator.compare(a.name, b.name));
}

/** The list with item `i` moved by `by` places (−1 up, +1 down); unchanged at the ends. */
export function moveItem<T>(list: readonly T[], i: number, by: -1 | 1): T[] {
  const j = i + by;
  if (i < 0 || i >= list.length || j < 0 || j >= list.length) return [...list];
  const out = [...list];
  [out[i], out[j]] = [out[j], out[i]];
  return out;
}

/**
 * How far each frame's bytes have gone, 0–1, from the bytes sent of the whole body: the frames
 * go one after another in list order, after the small fields (their share is ignored).
 */
export function frameProgress(sizes: readonly number[], loaded: number, total: number): number[] {
  const bytes = sizes.reduce((a, b) => a + b, 0);
  const head = Math.max(0, total - bytes);
  let offset = head;
  return sizes.map((s) => {
    const p = s === 0 ? 1 : Math.max(0, Math.min(1, (loaded - offset) / s));
    offset += s;
    return p;
  });
}
