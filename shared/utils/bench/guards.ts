// Every engine entry point validates its own inputs so a caller that skips the
// schemas still gets a RangeError naming the field, never a silent NaN.

export function requireFinite(name: string, value: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number`)
  }
  return value
}

export function requirePositive(name: string, value: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${name} must be a positive number`)
  }
  return value
}

export function requireNonNegative(name: string, value: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
    throw new RangeError(`${name} must be a non-negative number`)
  }
  return value
}

export function requireFraction(name: string, value: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0 || value >= 1) {
    throw new RangeError(`${name} must be a fraction from 0 up to (not including) 1`)
  }
  return value
}

export function requireWholeAtLeast(name: string, value: number, min: number): number {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min) {
    throw new RangeError(`${name} must be a whole number of at least ${min}`)
  }
  return value
}
