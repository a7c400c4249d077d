/** Limits for one numeric input; `above` and `below` are exclusive bounds. */
export interface NumberLimits {
  min?: number;
  above?: number;
  max?: number;
  below?: number;
  integer?: boolean;
}

function describe(limits: NumberLimits): string {
  const bounds: string[] = [];
  if (limits.above !== undefined) bounds.push(`above ${limits.above}`);
  if (limits.min !== undefined) bounds.push(`at least ${limits.min}`);
  if (limits.max !== undefined) bounds.push(`at most ${limits.max}`);
  if (limits.below !== undefined) bounds.push(`below ${limits.below}`);
  const kind = limits.integer ? 'a whole number' : 'a number';
  return bounds.length ? `${kind} ${bounds.join(' and ')}` : kind;
}

/** Rejects anything but a finite number within the limits, with a message naming the field. */
export function checkNumber(field: string, value: number, limits: NumberLimits): void {
  const ok =
    typeof value === 'number' &&
    Number.isFinite(value) &&
    (limits.min === undefined || value >= limits.min) &&
    (limits.above === undefined || value > limits.above) &&
    (limits.max === undefined || value <= limits.max) &&
    (limits.below === undefined || value < limits.below) &&
    (!limits.integer || Number.isInteger(value));
  if (!ok) throw new RangeError(`${field} must be ${describe(limits)}; got ${String(value)}`);
}

/** Rejects a value outside a fixed list, with a message naming the field. */
export function checkOneOf<T>(field: string, value: T, allowed: readonly T[]): void {
  if (!allowed.includes(value)) throw new RangeError(`${field} must be one of ${allowed.join(', ')}; got ${String(value)}`);
}
