import { applyDecorators } from '@nestjs/common';
import { ValidateBy, ValidateIf } from 'class-validator';

/**
 * A field that may be left out, but not sent as null. class-validator's own IsOptional lets null
 * through every other check, so `{"role": null}` reached the services and failed there with a
 * 500. Here only `undefined` skips the checks; null is refused with a message that says so.
 */
export function IsOptional(): PropertyDecorator {
  return applyDecorators(
    ValidateIf((_object: object, value: unknown) => value !== undefined),
    ValidateBy({
      name: 'isNotNull',
      validator: {
        validate: (value: unknown) => value !== null,
        defaultMessage: (args) => `${args?.property ?? 'a field'} may be left out but not sent as null`,
      },
    }),
  );
}

/** A field that may be left out or sent as null on purpose (e.g. an open window's end). */
export function IsOptionalOrNull(): PropertyDecorator {
  return ValidateIf((_object: object, value: unknown) => value !== undefined && value !== null);
}
