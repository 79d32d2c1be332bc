import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsBoolean, IsIn, IsString, MaxLength, MinLength } from 'class-validator';
import { IsOptional } from '../../common/validation/is-optional';
import { ROLES, type Role, type UpdateUserRequest } from '@morrowline/shared';

export class UpdateUserDto implements UpdateUserRequest {
  @ApiPropertyOptional({ enum: ROLES }) @IsOptional() @IsIn([...ROLES], { message: `role must be one of ${ROLES.join(', ')}` })
  role?: Role;

  @ApiPropertyOptional() @IsOptional() @IsBoolean()
  active?: boolean;

  @ApiPropertyOptional() @IsOptional() @IsString() @MinLength(1) @MaxLength(120)
  name?: string;

  @ApiPropertyOptional() @IsOptional() @IsString() @MaxLength(500)
  reason?: string;
}
