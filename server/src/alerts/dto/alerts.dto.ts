import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsInt, IsString, Max, MaxLength, Min } from 'class-validator';
import { ToInteger } from '../../common/validation/to-integer';
import { IsOptional } from '../../common/validation/is-optional';
import type { AcknowledgeAlertRequest, AlertState } from '@morrowline/shared';
import { IsZoneCode } from '../../common/validation/is-zone-code';

export class AlertsQueryDto {
  @ApiPropertyOptional({ enum: ['open', 'acknowledged'] })
  @IsOptional() @IsIn(['open', 'acknowledged'], { message: 'state must be open or acknowledged' })
  state?: AlertState;

  @ApiPropertyOptional({ example: 'MILLRACE' })
  @IsOptional() @IsZoneCode()
  zone?: string;

  @IsOptional() @ToInteger() @IsInt() @Min(1) @Max(1000)
  limit: number = 200;
}

export class AcknowledgeAlertDto implements AcknowledgeAlertRequest {
  @ApiPropertyOptional({ example: 'Smelter line 2 tripped; restoring' })
  @IsOptional() @IsString() @MaxLength(1000)
  comment?: string;
}
