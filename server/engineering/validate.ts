import { EngineeringInputError } from './errors';

// Guards shared by every public entry point, so refusals read the same everywhere.

export function requireFinite(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new EngineeringInputError(field, 'must be a number');
  }
  return value;
}

export function requirePositive(value: unknown, field: string, what = 'this value'): number {
  const v = requireFinite(value, field);
  if (v <= 0) throw new EngineeringInputError(field, `${what} must be greater than zero (got ${v})`);
  return v;
}

export function requireNonNegative(value: unknown, field: string, what = 'this value'): number {
  const v = requireFinite(value, field);
  if (v < 0) throw new EngineeringInputError(field, `${what} cannot be negative (got ${v})`);
  return v;
}

export function requireInRange(value: unknown, field: string, min: number, max: number, what = 'this value'): number {
  const v = requireFinite(value, field);
  if (v < min || v > max)
    throw new EngineeringInputError(field, `${what} must be between ${min} and ${max} (got ${v})`);
  return v;
}

export function requireInteger(value: unknown, field: string, min: number, max: number, what = 'this value'): number {
  const v = requireFinite(value, field);
  if (!Number.isInteger(v) || v < min || v > max) {
    throw new EngineeringInputError(field, `${what} must be a whole number from ${min} to ${max} (got ${v})`);
  }
  return v;
}

export function requireOneOf<T extends string>(value: unknown, field: string, allowed: readonly T[]): T {
  if (typeof value !== 'string' || !(allowed as readonly string[]).includes(value)) {
    throw new EngineeringInputError(field, `must be one of ${allowed.join(', ')} (got ${String(value)})`);
  }
  return value as T;
}

export function requireArray<T>(value: unknown, field: string, minLength: number, what = 'list'): T[] {
  if (!Array.isArray(value)) throw new EngineeringInputError(field, `must be a ${what}`);
  if (value.length < minLength) {
    throw new EngineeringInputError(
      field,
      `needs at least ${minLength} entr${minLength === 1 ? 'y' : 'ies'} (got ${value.length})`,
    );
  }
  return value as T[];
}
