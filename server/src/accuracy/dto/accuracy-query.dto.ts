import { ApiProperty } from '@nestjs/swagger';
import { IsString } from 'class-validator';
import { ZoneCodeList } from '../../common/validation/zone-code-list';

export class AccuracyQueryDto {
  @ZoneCodeList('Zone code(s), comma-separated or repeated; every active zone when omitted', 'MILLRACE,HARROW')
  zone?: string[];

  // Read by the one day parser in the service (a real date, years 2000 to 2100).
  @ApiProperty({ description: 'First operating day, YYYY-MM-DD (included), years 2000 to 2100', example: '2026-11-01' })
  @IsString({ message: 'from must be an operating day, YYYY-MM-DD' })
  from!: string;

  @ApiProperty({ description: 'Last operating day, YYYY-MM-DD (included), years 2000 to 2100', example: '2026-11-30' })
  @IsString({ message: 'to must be an operating day, YYYY-MM-DD' })
  to!: string;
}
