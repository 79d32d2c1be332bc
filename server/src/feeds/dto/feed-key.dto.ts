import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsString, Matches, MaxLength, MinLength } from 'class-validator';
import type { CreateFeedKeyRequest } from '@morrowline/shared';

export class CreateFeedKeyDto implements CreateFeedKeyRequest {
  @ApiProperty({ example: 'Millrace substation RTU' })
  @IsString() @MinLength(1) @MaxLength(80)
  name!: string;

  @ApiPropertyOptional({ description: 'Limit the key to one zone', example: 'MILLRACE' })
  @IsOptional()
  @Matches(/^[A-Z][A-Z0-9_-]{1,31}$/, { message: 'zone must be a zone code such as MILLRACE' })
  zone?: string | null;
}

export class RevokeFeedKeyDto {
  @ApiPropertyOptional() @IsOptional() @IsString() @MaxLength(500)
  reason?: string;
}
