interface RangeOptions {
  /** The bound itself is refused (e.g. a pace must be more than 0). */
  exclusiveMin?: boolean
  integer?: boolean
}

/** Throws a RangeError naming the input unless it is a finite number within [min, max]. */
export function checkNumber(name: string, value: number, min: number, max: number, options: RangeOptions = {}): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number (got ${String(value)})`)
  }
  if (options.integer && !Number.isInteger(value)) {
    throw new RangeError(`${name} must be a whole number (got ${value})`)
  }
  if (options.exclusiveMin ? value <= min : value < min) {
    throw new RangeError(`${name} must be ${options.exclusiveMin ? 'more than' : 'at least'} ${min} (got ${value})`)
  }
  if (value > max) {
    throw new RangeError(`${name} must be at most ${max} (got ${value})`)
  }
  return value
}
