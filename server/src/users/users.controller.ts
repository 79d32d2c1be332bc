import { Body, Controller, Get, Param, Patch, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { PERMISSIONS, type UserDto } from '@morrowline/shared';
import type { AuthUser } from '../common/auth-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { CreateUserDto } from './dto/create-user.dto';
import { UpdateUserDto } from './dto/update-user.dto';
import { UsersService } from './users.service';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';

@ApiTags('users')
@ApiBearerAuth()
@Controller('users')
@Roles(...PERMISSIONS.administer)
export class UsersController {
  constructor(private readonly users: UsersService) {}

  @Get()
  list(): Promise<UserDto[]> {
    return this.users.list();
  }

  @Post()
  create(@CurrentUser() actor: AuthUser, @Body() body: CreateUserDto): Promise<UserDto> {
    return this.users.create(actor, body);
  }

  @Patch(':id')
  update(@CurrentUser() actor: AuthUser, @Param('id', ParseIdPipe) id: number, @Body() body: UpdateUserDto): Promise<UserDto> {
    return this.users.update(actor, id, body);
  }
}
