// Input checks shared by the science core. Each throws a ScienceInputError that says what is wrong.
import { ScienceInputError } from "./errors";

function describe(value: unknown): string {
  return typeof value === "number" ? String(value) : typeof value;
}

export function requireFinite(value: number, field: string): number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new ScienceInputError(field, `must be a finite number, got ${describe(value)}`);
  }
  return value;
}

export function requirePositive(value: number, field: string): number {
  requireFinite(value, field);
  if (value <= 0) throw new ScienceInputError(field, `must be greater than 0, got ${value}`);
  return value;
}

export function requireNonNegative(value: number, field: string): number {
  requireFinite(value, field);
  if (value < 0) throw new ScienceInputError(field, `must not be negative, got ${value}`);
  return value;
}

export function requireRange(value: number, field: string, min: number, max: number): number {
  requireFinite(value, field);
  if (value < min || value > max) {
    throw new ScienceInputError(field, `must be between ${min} and ${max}, got ${value}`);
  }
  return value;
}

export function requireLatitude(latitudeDeg: number, field = "latitudeDeg"): number {
  return requireRange(latitudeDeg, field, -90, 90);
}

export function requirePositiveInteger(value: number, field: string): number {
  if (!Number.isInteger(value) || value < 1) {
    throw new ScienceInputError(
      field,
      `must be a whole number of at least 1, got ${describe(value)}`,
    );
  }
  return value;
}

export function requireNonEmpty<T>(items: ArrayLike<T> | undefined, field: string): ArrayLike<T> {
  if (items === undefined || items === null || typeof items.length !== "number") {
    throw new ScienceInputError(field, "must be an array");
  }
  if (items.length === 0) throw new ScienceInputError(field, "must not be empty");
  return items;
}

export function requireName(value: string, field: string): string {
  if (typeof value !== "string" || value.trim() === "") {
    throw new ScienceInputError(field, "must be a non-empty name");
  }
  return value;
}

/** Guards results: the science core never hands out NaN or Infinity. */
export function requireFiniteResult(value: number, field: string, reason: string): number {
  if (!Number.isFinite(value)) throw new ScienceInputError(field, reason);
  return value;
}
