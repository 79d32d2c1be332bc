import { registerDecorator, type ValidationOptions } from 'class-validator';
import { IANAZone } from 'luxon';

/** An IANA time-zone name that this server's time-zone database knows (e.g. America/Denver). */
export function IsTimeZone(options?: ValidationOptions) {
  return (target: object, propertyName: string) =>
    registerDecorator({
      name: 'isTimeZone',
      target: target.constructor,
      propertyName,
      options: { message: `${propertyName} must be an IANA time zone such as America/Denver`, ...options },
      validator: { validate: (value: unknown) => typeof value === 'string' && IANAZone.isValidZone(value) },
    });
}
