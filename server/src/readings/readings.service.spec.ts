import { BadRequestException } from '@nestjs/common';
import type { DomainEventsPublisher } from '../events/domain-events.publisher';
import type { Zone } from '../zones/entities/zone.entity';
import type { ZonesRepository } from '../zones/zones.repository';
import type { ReadingsRepository } from './readings.repository';
import { ReadingsService } from './readings.service';

/** The zones table as a list the test grows, counting how often the service reads it. */
function zonesTable(codes: string[]) {
  const rows = codes.map((code, i) => ({ id: i + 1, code, minPlausibleMw: 0, maxPlausibleMw: 500 }));
  const table = {
    reads: 0,
    add(code: string) {
      rows.push({ id: rows.length + 1, code, minPlausibleMw: 0, maxPlausibleMw: 500 });
    },
    switchOff(code: string) {
      rows.splice(rows.findIndex((r) => r.code === code), 1);
    },
    repository: {
      active: async () => {
        table.reads++;
        return rows.map((r) => ({ ...r }) as unknown as Zone);
      },
    } as unknown as ZonesRepository,
  };
  return table;
}

const service = (zones: ZonesRepository) => new ReadingsService(zones, {} as ReadingsRepository, {} as DomainEventsPublisher);

describe('ReadingsService.resolveZones (the short-lived list of active zones)', () => {
  it('answers known codes from the list it read a moment ago, without reading the table again', async () => {
    const table = zonesTable(['MILLRACE', 'HARROW']);
    const readings = service(table.repository);
    expect((await readings.resolveZones(undefined)).map((z) => z.code)).toEqual(['MILLRACE', 'HARROW']);
    expect((await readings.resolveZones(['HARROW'])).map((z) => z.code)).toEqual(['HARROW']);
    expect(table.reads).toBe(1);
  });

  it('reads the table again for a code its list lacks, so a zone added a moment ago is found at once', async () => {
    const table = zonesTable(['MILLRACE']);
    const readings = service(table.repository);
    await readings.resolveZones(undefined);
    table.add('WILLOW');
    expect((await readings.resolveZones(['MILLRACE', 'WILLOW'])).map((z) => [z.id, z.code])).toEqual([
      [1, 'MILLRACE'],
      [2, 'WILLOW'],
    ]);
    expect(table.reads).toBe(2);
    // and the list read then serves the next request
    await readings.resolveZones(['WILLOW']);
    expect(table.reads).toBe(2);
  });

  it('still refuses a code that names no active zone, once the table has been read afresh', async () => {
    const table = zonesTable(['MILLRACE']);
    const readings = service(table.repository);
    await readings.resolveZones(undefined);
    await expect(readings.resolveZones(['NOSUCH'])).rejects.toThrow(new BadRequestException('No active zone with code NOSUCH'));
    expect(table.reads).toBe(2);
  });

  it('drops its list when a zone changes, so a zone switched off a moment ago is no longer served', async () => {
    const table = zonesTable(['MILLRACE', 'HARROW']);
    const readings = service(table.repository);
    await readings.resolveZones(undefined);
    table.switchOff('HARROW');
    // without the change event the list of a moment ago still answers
    expect((await readings.resolveZones(undefined)).map((z) => z.code)).toEqual(['MILLRACE', 'HARROW']);
    readings.onZoneChanged();
    expect((await readings.resolveZones(undefined)).map((z) => z.code)).toEqual(['MILLRACE']);
    await expect(readings.resolveZones(['HARROW'])).rejects.toThrow(new BadRequestException('No active zone with code HARROW'));
  });
});
