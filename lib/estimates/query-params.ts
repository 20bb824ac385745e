/**
 * Reading estimate parameters from URL query strings: every value arrives as a string or is
 * missing. Missing and malformed values both become EstimateInputError naming the parameter.
 */
import { EstimateInputError } from "./input-error";

export type QueryParams = Record<string, string | undefined>;

/** A trimmed, non-empty string, or undefined. */
function raw(params: QueryParams, name: string): string | undefined {
  const v = params[name];
  return v === undefined || v.trim() === "" ? undefined : v.trim();
}

/**
 * A positive number; the default applies when the parameter is absent. `allowZero` admits 0
 * (thicknesses, defect densities). Number() is strict: "12abc" is rejected, unlike parseFloat.
 */
export function numberParam(params: QueryParams, name: string, options: { default?: number; allowZero?: boolean } = {}): number {
  const text = raw(params, name);
  if (text === undefined) {
    if (options.default !== undefined) return options.default;
    throw new EstimateInputError(name, `${name} must be a positive number`);
  }
  const value = Number(text);
  const ok = Number.isFinite(value) && (options.allowZero ? value >= 0 : value > 0);
  if (!ok) throw new EstimateInputError(name, options.allowZero ? `${name} must be a number of zero or more` : `${name} must be a positive number`);
  return value;
}

/** A number when present, otherwise undefined (for parameters whose absence means something). */
export function optionalNumberParam(params: QueryParams, name: string): number | undefined {
  return raw(params, name) === undefined ? undefined : numberParam(params, name);
}

/** One of the allowed words; the default applies when absent. */
export function enumParam<T extends string>(params: QueryParams, name: string, allowed: readonly T[], fallback?: T): T {
  const text = raw(params, name) ?? fallback;
  if (text === undefined || !(allowed as readonly string[]).includes(text)) {
    throw new EstimateInputError(name, `${name} must be one of ${allowed.join(", ")}`);
  }
  return text as T;
}

/** true/false (also 1/0, yes/no); the default applies when absent. */
export function booleanParam(params: QueryParams, name: string, fallback: boolean): boolean {
  const text = raw(params, name)?.toLowerCase();
  if (text === undefined) return fallback;
  if (["true", "1", "yes"].includes(text)) return true;
  if (["false", "0", "no"].includes(text)) return false;
  throw new EstimateInputError(name, `${name} must be true or false`);
}
