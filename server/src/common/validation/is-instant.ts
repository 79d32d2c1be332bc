import { applyDecorators } from '@nestjs/common';
import { Transform } from 'class-transformer';
import { ValidateBy } from 'class-validator';
import { parseDay, parseInstant } from '@morrowline/shared';

/** How a field words its refusal of text that is not a date and time at all (its published message). */
export interface InstantMessages {
  notATime?: string;
}

/**
 * The parser's message for a refused value: its own for a wrong date, hour, offset or year, or the
 * field's own wording, when it has one, for text that is not a date and time at all.
 */
function instantMessage(value: unknown, property: string, messages: InstantMessages | undefined): string {
  const result = parseInstant(value, property);
  if (result.ok) return '';
  return messages?.notATime && (typeof value !== 'string' || result.message === `${property} must be an ISO 8601 date and time`) ? messages.notATime : result.message;
}

/** Text that shared/src/instant.ts reads as an instant (offset required, real date, in the window). */
export function IsInstant(messages?: InstantMessages): PropertyDecorator {
  return ValidateBy({
    name: 'isInstant',
    validator: {
      validate: (value: unknown) => parseInstant(value).ok,
      defaultMessage: (args) => instantMessage(args?.value, args?.property ?? 'time', messages),
    },
  });
}

/**
 * A query instant, read by the one time parser and handed on as a Date. The text is kept as it
 * came when it cannot be read, so that the check below reports the parser's message.
 */
export function IsInstantDate(messages?: InstantMessages): PropertyDecorator {
  return applyDecorators(
    Transform(({ value }: { value: unknown }) => {
      const result = parseInstant(value);
      return result.ok ? new Date(result.value) : value;
    }),
    ValidateBy({
      name: 'isInstantDate',
      validator: {
        validate: (value: unknown) => value instanceof Date,
        defaultMessage: (args) => instantMessage(args?.value, args?.property ?? 'time', messages),
      },
    }),
  );
}

/** Text that shared/src/instant.ts reads as an operating day, YYYY-MM-DD (a real date in the window). */
export function IsDay(): PropertyDecorator {
  return ValidateBy({
    name: 'isDay',
    validator: {
      validate: (value: unknown) => parseDay(value).ok,
      defaultMessage: (args) => {
        const result = parseDay(args?.value, args?.property ?? 'day');
        return result.ok ? '' : result.message;
      },
    },
  });
}
