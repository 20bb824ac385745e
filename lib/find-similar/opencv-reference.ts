import { createRequire } from "node:module";
import type { Gray } from "./types";

/**
 * Tests and benches only: OpenCV's `matchTemplate` (opencv.js, the WebAssembly build of
 * OpenCV 4.5) as the outside reference for ZNCC score maps.
 */

type Mat = { data32F: Float32Array; rows: number; cols: number; delete(): void };
export type OpenCv = {
  Mat: new () => Mat;
  matFromArray(rows: number, cols: number, type: number, data: ArrayLike<number>): Mat;
  matchTemplate(image: Mat, templ: Mat, result: Mat, method: number): void;
  CV_32F: number;
  CV_8U: number;
  TM_CCOEFF_NORMED: number;
  onRuntimeInitialized?: () => void;
};

let loaded: Promise<{ cv: OpenCv }> | null = null;

/**
 * Loads opencv.js once. Its module object is a thenable (emscripten's `then`) that is not ready
 * until onRuntimeInitialized, and awaiting or resolving with it directly never settles, so it
 * is handed out inside a wrapper (take `.cv` after the await).
 */
export function loadOpenCv(): Promise<{ cv: OpenCv }> {
  loaded ??= (async () => {
    const mod = createRequire(import.meta.url)("@techstark/opencv-js") as OpenCv;
    if (typeof mod.matchTemplate !== "function" || typeof mod.Mat !== "function") {
      await new Promise<void>((resolve) => (mod.onRuntimeInitialized = resolve));
    }
    return { cv: mod };
  })();
  return loaded;
}

/** OpenCV's TM_CCOEFF_NORMED map of `template` over `image` (both as 32-bit float mats). */
export function openCvScoreMap(cv: OpenCv, image: Gray, template: Gray): Gray {
  const img = cv.matFromArray(image.height, image.width, cv.CV_32F, image.data);
  const tpl = cv.matFromArray(template.height, template.width, cv.CV_32F, template.data);
  const res = new cv.Mat();
  try {
    cv.matchTemplate(img, tpl, res, cv.TM_CCOEFF_NORMED);
    return { width: res.cols, height: res.rows, data: Float32Array.from(res.data32F) };
  } finally {
    img.delete();
    tpl.delete();
    res.delete();
  }
}
