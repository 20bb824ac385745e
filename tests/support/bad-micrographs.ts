// The bad-file corpus shared by the multipart and the resumable (tus) upload tests: each file
// must be refused with this status and message, whatever the transport, leaving nothing behind.
import { pngDeclaring } from "./images";

export type BadFile = { name: string; bytes: () => Buffer; fileName: string; fields?: Record<string, string>; status: number; message: RegExp };

/**
 * The corpus, around a valid JPEG and PNG the caller makes (in a beforeAll: `files` is read only
 * when a test asks for the bytes, so the test names exist before the images do).
 */
export function badMicrographs(files: () => { jpeg: Buffer; png: Buffer }): BadFile[] {
  const text = (s: string) => () => Buffer.from(s, "utf8");
  const jpeg = () => files().jpeg;
  return [
    { name: "a zero-byte file", bytes: () => Buffer.alloc(0), fileName: "empty.jpg", status: 400, message: /empty/ },
    {
      name: "text renamed .jpg",
      bytes: text("just some notes, not an image at all\n".repeat(4)),
      fileName: "notes.jpg",
      status: 415,
      message: /Only JPEG, PNG, TIFF/,
    },
    { name: "a truncated JPEG", bytes: () => jpeg().subarray(0, Math.floor(jpeg().length * 0.6)), fileName: "cut.jpg", status: 422, message: /incomplete/ },
    {
      name: "a truncated PNG",
      bytes: () => files().png.subarray(0, Math.floor(files().png.length * 0.6)),
      fileName: "cut.png",
      status: 422,
      message: /incomplete/,
    },
    { name: "a PNG declaring 100000 × 100000 px", bytes: () => pngDeclaring(100_000, 100_000), fileName: "bomb.png", status: 413, message: /pixel/i },
    {
      name: "an SVG",
      bytes: text('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><rect width="10" height="10"/></svg>'),
      fileName: "die.svg",
      status: 415,
      message: /Only JPEG/,
    },
    {
      name: "an HTML page",
      bytes: text("<!doctype html><html><body><script>alert(1)</script></body></html>"),
      fileName: "die.jpg",
      status: 415,
      message: /Only JPEG/,
    },
    {
      name: "a TIFF with a bad header",
      bytes: () => Buffer.concat([Buffer.from([0x49, 0x49, 0x2a, 0x00, 0xff, 0xff, 0xff, 0x7f]), Buffer.alloc(200, 7)]),
      fileName: "bad.tif",
      status: 415,
      message: /TIFF|format|read/i,
    },
    { name: "a file name with ../", bytes: jpeg, fileName: "../../etc/die.jpg", status: 400, message: /plain name/ },
    { name: "a wrong field type", bytes: jpeg, fileName: "die.jpg", fields: { objectiveMag: "twenty" }, status: 400, message: /objectiveMag must be a number/ },
    { name: "an unknown illumination", bytes: jpeg, fileName: "die.jpg", fields: { illumination: "uv" }, status: 400, message: /illumination must be one of/ },
    {
      name: "a label with a NUL character",
      bytes: jpeg,
      fileName: "die.jpg",
      fields: { label: "bright\u0000field" },
      status: 400,
      message: /label contains a NUL character/,
    },
  ];
}
