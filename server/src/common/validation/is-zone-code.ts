import { ValidateBy, type ValidationOptions } from 'class-validator';
import { isZoneCode } from '@morrowline/shared';

/**
 * A zone code (shared/src/zone-code.ts), with one message for every field that takes one:
 * "zone must be a zone code such as MILLRACE", or for a list (`each: true`) "zone must be zone
 * codes such as MILLRACE".
 */
export function IsZoneCode(options?: ValidationOptions): PropertyDecorator {
  return ValidateBy(
    {
      name: 'isZoneCode',
      validator: {
        validate: (value: unknown) => isZoneCode(value),
        defaultMessage: (args) => `${args?.property ?? 'zone'} must be ${options?.each ? 'zone codes' : 'a zone code'} such as MILLRACE`,
      },
    },
    options,
  );
}
