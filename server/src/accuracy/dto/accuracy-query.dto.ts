import { ApiProperty } from '@nestjs/swagger';
import { Matches } from 'class-validator';
import { ZoneCodeList } from '../../common/validation/zone-code-list';

const DAY = /^\d{4}-\d{2}-\d{2}$/;

export class AccuracyQueryDto {
  @ZoneCodeList('Zone code(s), comma-separated or repeated; every active zone when omitted', 'MILLRACE,HARROW')
  zone?: string[];

  @ApiProperty({ description: 'First operating day, yyyy-MM-dd (included)', example: '2026-11-01' })
  @Matches(DAY, { message: 'from must be an operating day, yyyy-MM-dd' })
  from!: string;

  @ApiProperty({ description: 'Last operating day, yyyy-MM-dd (included)', example: '2026-11-30' })
  @Matches(DAY, { message: 'to must be an operating day, yyyy-MM-dd' })
  to!: string;
}
