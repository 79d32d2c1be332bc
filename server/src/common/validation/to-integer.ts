import { Transform } from 'class-transformer';

/** Optional minus, then digits with no leading zero: how a person or a client writes a whole number. */
const PLAIN_INTEGER = /^-?(?:0|[1-9]\d{0,15})$/;

/**
 * A whole number from a query string, read strictly: "20" becomes 20, while "0x10", "1e3", " 5"
 * and "" stay text, so that @IsInt() refuses them with its message. (class-transformer's
 * Type(() => Number) used Number(), which reads "0x10" as 16.) A JSON number passes unchanged.
 */
export function ToInteger(): PropertyDecorator {
  return Transform(({ value }: { value: unknown }) => (typeof value === 'string' && PLAIN_INTEGER.test(value) ? Number(value) : value));
}
