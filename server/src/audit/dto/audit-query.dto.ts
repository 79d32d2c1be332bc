import { Type } from 'class-transformer';
import { IsDate, IsInt, IsOptional, IsString, Max, MaxLength, Min } from 'class-validator';

export class AuditQueryDto {
  @IsOptional() @Type(() => Number) @IsInt() @Min(1) @Max(500)
  limit: number = 50;

  @IsOptional() @Type(() => Number) @IsInt() @Min(0)
  offset: number = 0;

  @IsOptional() @IsString() @MaxLength(64)
  action?: string;

  @IsOptional() @IsString() @MaxLength(64)
  subjectType?: string;

  @IsOptional() @IsString() @MaxLength(64)
  subjectId?: string;

  @IsOptional() @Type(() => Number) @IsInt()
  actorId?: number;

  @IsOptional() @Type(() => Date) @IsDate()
  from?: Date;

  @IsOptional() @Type(() => Date) @IsDate()
  to?: Date;
}
