import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, IsString, Max, MaxLength, Min } from 'class-validator';
import type { AcknowledgeAlertRequest, AlertState } from '@morrowline/shared';
import { IsZoneCode } from '../../common/validation/is-zone-code';

export class AlertsQueryDto {
  @ApiPropertyOptional({ enum: ['open', 'acknowledged'] })
  @IsOptional() @IsIn(['open', 'acknowledged'], { message: 'state must be open or acknowledged' })
  state?: AlertState;

  @ApiPropertyOptional({ example: 'MILLRACE' })
  @IsOptional() @IsZoneCode()
  zone?: string;

  @IsOptional() @Type(() => Number) @IsInt() @Min(1) @Max(1000)
  limit: number = 200;
}

export class AcknowledgeAlertDto implements AcknowledgeAlertRequest {
  @ApiPropertyOptional({ example: 'Smelter line 2 tripped; restoring' })
  @IsOptional() @IsString() @MaxLength(1000)
  comment?: string;
}
