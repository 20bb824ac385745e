/**
 * Input checking shared by every estimate. Bad input is the caller's fault and names the
 * parameter, so the API route can answer 400 with a message the user can act on; inputs that
 * are valid but outside a formula's published range are warnings instead, never errors.
 */

/** Thrown for a missing, non-finite, zero or negative parameter (or an impossible geometry). */
export class EstimateInputError extends Error {
  /** The camelCase parameter name as used in the API query string. */
  readonly parameter: string;

  constructor(parameter: string, message: string) {
    super(message);
    this.name = "EstimateInputError";
    this.parameter = parameter;
  }
}

/** Returns the value when it is a finite number greater than zero; throws otherwise. */
export function requirePositive(name: string, value: number | undefined): number {
  if (typeof value !== "number" || !Number.isFinite(value) || value <= 0) {
    throw new EstimateInputError(name, `${name} must be a positive number`);
  }
  return value;
}

/** Returns the value when it is a finite number ≥ 0 (thicknesses and defect densities may be 0). */
export function requireNonNegative(name: string, value: number | undefined): number {
  if (typeof value !== "number" || !Number.isFinite(value) || value < 0) {
    throw new EstimateInputError(name, `${name} must be a number of zero or more`);
  }
  return value;
}

/** Returns the value when it is a whole number in [min, max]; throws otherwise. */
export function requireInteger(name: string, value: number | undefined, min: number, max: number): number {
  if (typeof value !== "number" || !Number.isInteger(value) || value < min || value > max) {
    throw new EstimateInputError(name, `${name} must be a whole number from ${min} to ${max}`);
  }
  return value;
}

/** Relative permittivity: finite and at least 1 (vacuum). */
export function requirePermittivity(name: string, value: number | undefined): number {
  requirePositive(name, value);
  if ((value as number) < 1) throw new EstimateInputError(name, `${name} must be at least 1`);
  return value as number;
}

/** Returns the value when it is one of the allowed strings; throws otherwise. */
export function requireOneOf<T extends string>(name: string, value: string | undefined, allowed: readonly T[]): T {
  if (value === undefined || !(allowed as readonly string[]).includes(value)) {
    throw new EstimateInputError(name, `${name} must be one of ${allowed.join(", ")}`);
  }
  return value as T;
}
