import { ValidateBy, type ValidationOptions } from 'class-validator';
import { isZoneCode } from '@morrowline/shared';

/** A station code: the zone-code rule (shared/src/zone-code.ts), "station must be a station code such as VALLEYFLOOR". */
export function IsStationCode(options?: ValidationOptions): PropertyDecorator {
  return ValidateBy(
    {
      name: 'isStationCode',
      validator: {
        validate: (value: unknown) => isZoneCode(value),
        defaultMessage: (args) => `${args?.property ?? 'station'} must be a station code such as VALLEYFLOOR (capital letters, digits, - or _)`,
      },
    },
    options,
  );
}
