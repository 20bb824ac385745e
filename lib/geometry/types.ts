/**
 * Coordinate spaces are branded so that mixing them fails to compile.
 *
 * - ImagePoint: pixels of one micrograph, origin top-left, x right, y down.
 * - DiePoint: micrometres in the die frame, origin at the die's lower-left corner, x right, y up.
 */
declare const space: unique symbol;

export type ImagePoint = { readonly x: number; readonly y: number; readonly [space]: "image" };
export type DiePoint = { readonly x: number; readonly y: number; readonly [space]: "die" };

export const imagePoint = (x: number, y: number) => ({ x, y }) as ImagePoint;
export const diePoint = (x: number, y: number) => ({ x, y }) as DiePoint;

/**
 * A 2x3 affine matrix [[a, b, tx], [c, d, ty]]: out = [[a, b], [c, d]]·in + [tx, ty].
 * Stored per micrograph as image px → die µm (the API's `transform`).
 */
export type Affine2x3 = readonly [readonly [number, number, number], readonly [number, number, number]];

/** The same matrix as stored in JSON (the `transform` column and the API field). */
export type Transform = [[number, number, number], [number, number, number]];

/** GeoJSON-shaped geometry in die µm (planar, not WGS84). */
export type Position = readonly [number, number];
export type PointGeometry = { readonly type: "Point"; readonly coordinates: Position };
export type LineStringGeometry = { readonly type: "LineString"; readonly coordinates: readonly Position[] };
export type PolygonGeometry = {
  readonly type: "Polygon";
  /** Rings closed as in RFC 7946: the first position repeated at the end. */
  readonly coordinates: readonly (readonly Position[])[];
};
export type Geometry = PointGeometry | LineStringGeometry | PolygonGeometry;
