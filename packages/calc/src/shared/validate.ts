/**
 * Input checks shared by every calculation. Each throws a RangeError whose
 * message names the input in words a user can read; the API turns it into a 422.
 */
export function requireFinite(value: number, name: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number (got ${String(value)}).`);
  }
  return value;
}

export function requirePositive(value: number, name: string): number {
  requireFinite(value, name);
  if (value <= 0) throw new RangeError(`${name} must be greater than zero (got ${value}).`);
  return value;
}

export function requireNonNegative(value: number, name: string): number {
  requireFinite(value, name);
  if (value < 0) throw new RangeError(`${name} must not be negative (got ${value}).`);
  return value;
}

export function requireFraction(value: number, name: string): number {
  requireFinite(value, name);
  if (value < 0 || value > 1) throw new RangeError(`${name} must be between 0 and 1 (got ${value}).`);
  return value;
}

export function requireInteger(value: number, name: string, min = 1): number {
  requireFinite(value, name);
  if (!Number.isInteger(value) || value < min) {
    throw new RangeError(`${name} must be a whole number of at least ${min} (got ${value}).`);
  }
  return value;
}
