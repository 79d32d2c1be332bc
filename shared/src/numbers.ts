/**
 * Numbers and ids as text arrives with them (CSV cells, URL path segments). JavaScript's own
 * Number("…") reads "0x10" as 16, "0b101" as 5, "1e3" as 1000 and "" or " " as 0; none of those
 * is how a meter or a person writes megawatts or an id, so these parsers accept plain decimal
 * notation only.
 */
import type { Parsed } from './instant';

/** Optional minus, digits (no leading zeros but a lone 0), optional fraction: "12", "-3", "0.25". */
const DECIMAL = /^-?(?:0|[1-9]\d*)(?:\.\d+)?$/;
/** A database id: 1 to 16 digits, no sign, no leading zero. */
const ID = /^[1-9]\d{0,15}$/;

/** Megawatts (or any decimal quantity) written in plain decimal notation. */
export function parseDecimal(text: unknown, field = 'value'): Parsed<number> {
  if (typeof text !== 'string' || text.length === 0) return { ok: false, message: `${field} is empty; a number such as 412.5 is needed` };
  if (!DECIMAL.test(text)) {
    const shown = JSON.stringify(text.length > 40 ? `${text.slice(0, 40)}…` : text);
    return { ok: false, message: `${field} ${shown} is not a plain decimal number (digits, one optional point, no exponent, hex or spaces)` };
  }
  const value = Number(text);
  return Number.isFinite(value) ? { ok: true, value } : { ok: false, message: `${field} is too large` };
}

/** A positive integer id within JavaScript's safe integer range, or null. */
export function parseId(text: unknown): number | null {
  if (typeof text !== 'string' || !ID.test(text)) return null;
  const value = Number(text);
  return Number.isSafeInteger(value) ? value : null;
}
