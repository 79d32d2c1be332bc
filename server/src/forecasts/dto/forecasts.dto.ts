import { Type } from 'class-transformer';
import { IsDate, IsOptional } from 'class-validator';
import { ZoneCodeList } from '../../common/validation/zone-code-list';

export class LatestForecastsQueryDto {
  @ZoneCodeList('comma-separated zone codes; all active zones when omitted', 'MILLRACE,COPPERLINE')
  zone?: string[];

  @IsOptional() @Type(() => Date) @IsDate({ message: 'from must be a time' })
  from?: Date;

  @IsOptional() @Type(() => Date) @IsDate({ message: 'to must be a time' })
  to?: Date;
}
