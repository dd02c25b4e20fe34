import { registerDecorator, type ValidationOptions } from 'class-validator';

/** A calendar date written YYYY-MM-DD that exists (2028-02-29 does, 2026-02-30 and 2026-13-01 do not). */
export function isIsoDate(value: unknown): value is string {
  if (typeof value !== 'string' || !/^\d{4}-\d{2}-\d{2}$/.test(value)) return false;
  const d = new Date(`${value}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === value;
}

/** The one validator for date fields of request bodies and queries: a real date YYYY-MM-DD. */
export function IsIsoDate(options?: ValidationOptions) {
  return (target: object, propertyName: string) =>
    registerDecorator({
      name: 'isIsoDate',
      target: target.constructor,
      propertyName,
      options: { message: `${propertyName} must be a real calendar date YYYY-MM-DD`, ...options },
      validator: { validate: isIsoDate },
    });
}
