import { applyDecorators } from '@nestjs/common';
import { ApiPropertyOptional } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { ArrayMaxSize, IsArray } from 'class-validator';
import { IsOptional } from './is-optional';
import { IsZoneCode } from './is-zone-code';

/** The most zones one query may name. */
export const MAX_ZONES_PER_QUERY = 50;

/**
 * An optional `zone` query parameter holding zone codes, repeated (`?zone=A&zone=B`) or
 * comma-separated (`?zone=A,B`); absent means every active zone. The one rule for every query
 * that takes several zones.
 */
export function ZoneCodeList(description: string, example = 'MILLRACE,HARROW'): PropertyDecorator {
  return applyDecorators(
    ApiPropertyOptional({ description, example }),
    IsOptional(),
    Transform(({ value }) => (Array.isArray(value) ? value : String(value).split(',')).map((v: string) => v.trim()).filter(Boolean)),
    IsArray(),
    ArrayMaxSize(MAX_ZONES_PER_QUERY),
    IsZoneCode({ each: true }),
  );
}
