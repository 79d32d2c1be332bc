import { ApiProperty } from '@nestjs/swagger';
import { IsEmail, IsString, MaxLength, MinLength } from 'class-validator';
import type { LoginRequest } from '@morrowline/shared';

export class LoginDto implements LoginRequest {
  @ApiProperty({ example: 'ines.marlow@tallowmere.example' })
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(254)
  email!: string;

  @ApiProperty()
  @IsString()
  @MinLength(1)
  @MaxLength(200)
  password!: string;
}
