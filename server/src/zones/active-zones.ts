import { BadRequestException } from '@nestjs/common';

/**
 * The one rule for "these zones, by code": each code must name an active zone (a 400 otherwise),
 * answered in the order asked. `active` is every active zone; no codes means all of them.
 */
export function pickActiveZones<T extends { code: string }>(active: readonly T[], codes: readonly string[] | undefined): T[] {
  if (!codes || codes.length === 0) return [...active];
  const byCode = new Map(active.map((z) => [z.code, z]));
  return codes.map((code) => {
    const zone = byCode.get(code);
    if (!zone) throw new BadRequestException(`No active zone with code ${code}`);
    return zone;
  });
}
