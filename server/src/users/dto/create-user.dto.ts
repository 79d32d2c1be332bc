import { ApiProperty } from '@nestjs/swagger';
import { IsEmail, IsIn, IsString, MaxLength, MinLength } from 'class-validator';
import { ROLES, type CreateUserRequest, type Role } from '@morrowline/shared';

export class CreateUserDto implements CreateUserRequest {
  @ApiProperty() @IsEmail({}, { message: 'email must be an e-mail address' }) @MaxLength(254)
  email!: string;

  @ApiProperty() @IsString() @MinLength(1) @MaxLength(120)
  name!: string;

  @ApiProperty({ enum: ROLES }) @IsIn([...ROLES], { message: `role must be one of ${ROLES.join(', ')}` })
  role!: Role;

  @ApiProperty({ minLength: 10 }) @IsString() @MinLength(10, { message: 'password must be at least 10 characters' }) @MaxLength(200)
  password!: string;
}
