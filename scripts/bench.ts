// `npm run bench`: figures for the speed and memory targets in the issues. Not a test: it
// prints measurements and ratios against reference runs made in the same script.
import { benchTiling } from "./bench/tiling";
import { benchUpload } from "./bench/upload";
import { benchMarkup } from "./bench/markup";
import { benchExport } from "./bench/export";
import { benchServe } from "./bench/serve";
import { benchStorage } from "./bench/storage";
import { benchMosaic } from "./bench/mosaic";

const only = process.argv[2];
if (!only || only === "tiling") await benchTiling();
if (!only || only === "upload") await benchUpload();
if (!only || only === "markup") await benchMarkup();
if (!only || only === "export") await benchExport();
if (!only || only === "serve") await benchServe();
if (!only || only === "storage") await benchStorage();
if (!only || only === "mosaic") await benchMosaic();
