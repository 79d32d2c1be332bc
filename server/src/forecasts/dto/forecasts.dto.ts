import { IsInt, Max, Min } from 'class-validator';
import { IsInstantDate } from '../../common/validation/is-instant';
import { IsOptional } from '../../common/validation/is-optional';
import { IsZoneCode } from '../../common/validation/is-zone-code';
import { ToInteger } from '../../common/validation/to-integer';
import { ZoneCodeList } from '../../common/validation/zone-code-list';

export class LatestForecastsQueryDto {
  @ZoneCodeList('comma-separated zone codes; all active zones when omitted', 'MILLRACE,COPPERLINE')
  zone?: string[];

  @IsOptional() @IsInstantDate({ notATime: 'from must be a time' })
  from?: Date;

  @IsOptional() @IsInstantDate({ notATime: 'to must be a time' })
  to?: Date;
}

export class ForecastRunsQueryDto {
  @IsZoneCode()
  zone!: string;

  @IsOptional() @ToInteger() @IsInt({ message: 'limit must be a whole number' }) @Min(1) @Max(500)
  limit?: number;
}

export class ForecastDiffQueryDto {
  @ToInteger() @IsInt({ message: 'against must be a forecast run id' }) @Min(1, { message: 'against must be a forecast run id' })
  against!: number;

  @IsOptional() @IsInstantDate({ notATime: 'from must be a time' })
  from?: Date;

  @IsOptional() @IsInstantDate({ notATime: 'to must be a time' })
  to?: Date;
}
