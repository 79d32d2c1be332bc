import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsString, MaxLength, MinLength } from 'class-validator';
import type { CreateFeedKeyRequest } from '@morrowline/shared';
import { IsZoneCode } from '../../common/validation/is-zone-code';

export class CreateFeedKeyDto implements CreateFeedKeyRequest {
  @ApiProperty({ example: 'Millrace substation RTU' })
  @IsString() @MinLength(1) @MaxLength(80)
  name!: string;

  @ApiPropertyOptional({ description: 'Limit the key to one zone', example: 'MILLRACE' })
  @IsOptional()
  @IsZoneCode()
  zone?: string | null;
}

export class RevokeFeedKeyDto {
  @ApiPropertyOptional() @IsOptional() @IsString() @MaxLength(500)
  reason?: string;
}
