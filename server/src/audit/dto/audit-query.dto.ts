import { IsInt, IsString, Max, MaxLength, Min } from 'class-validator';
import { IsInstantDate } from '../../common/validation/is-instant';
import { ToInteger } from '../../common/validation/to-integer';
import { IsOptional } from '../../common/validation/is-optional';

export class AuditQueryDto {
  @IsOptional() @ToInteger() @IsInt() @Min(1) @Max(500)
  limit: number = 50;

  @IsOptional() @ToInteger() @IsInt() @Min(0)
  offset: number = 0;

  @IsOptional() @IsString() @MaxLength(64)
  action?: string;

  @IsOptional() @IsString() @MaxLength(64)
  subjectType?: string;

  @IsOptional() @IsString() @MaxLength(64)
  subjectId?: string;

  @IsOptional() @ToInteger() @IsInt()
  actorId?: number;

  @IsOptional() @IsInstantDate()
  from?: Date;

  @IsOptional() @IsInstantDate()
  to?: Date;
}
