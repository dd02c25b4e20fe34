import { registerDecorator, type ValidationOptions } from 'class-validator';

/**
 * An IANA time zone name such as "Europe/London" or "UTC", as known to the runtime's ICU data
 * (Intl). UTC offsets like "+01:00" are refused: they have no daylight-saving rules.
 */
export function isIanaTimeZone(value: unknown): value is string {
  if (
    typeof value !== 'string' ||
    value.length > 64 ||
    !/^[A-Za-z][A-Za-z0-9_+-]*(\/[A-Za-z0-9_+-]+)*$/.test(value)
  ) {
    return false;
  }
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone: value });
    return true;
  } catch {
    return false;
  }
}

export function IsIanaTimeZone(options?: ValidationOptions) {
  return (target: object, propertyName: string) =>
    registerDecorator({
      name: 'isIanaTimeZone',
      target: target.constructor,
      propertyName,
      options: {
        message: `${propertyName} must be an IANA time zone name such as Europe/London`,
        ...options,
      },
      validator: { validate: isIanaTimeZone },
    });
}
