import { Body, Controller, Get, HttpCode, Ip, Post, UseGuards } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { Throttle } from '@nestjs/throttler';
import type { LoginResponse, UserDto } from '@morrowline/shared';
import type { AuthUser } from '../common/auth-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Public, SignedIn } from '../common/decorators/roles.decorator';
import { UsersService, toUserDto } from '../users/users.service';
import { AuthService } from './auth.service';
import { LoginDto } from './dto/login.dto';
import { LoginThrottlerGuard } from './guards/login-throttler.guard';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(
    private readonly auth: AuthService,
    private readonly users: UsersService,
  ) {}

  @Post('login')
  @Public()
  @HttpCode(200)
  @UseGuards(LoginThrottlerGuard)
  @Throttle({ login: {} })
  login(@Body() body: LoginDto, @Ip() address: string): Promise<LoginResponse> {
    return this.auth.login(body.email, body.password, address);
  }

  @Get('me')
  @SignedIn()
  @ApiBearerAuth()
  async me(@CurrentUser() user: AuthUser): Promise<UserDto> {
    return toUserDto(await this.users.getById(user.id));
  }

  /**
   * Sign-out ends the user's sessions: the token (and any other the user holds) is refused from
   * now on and open desk sockets close. Recorded for the shift log.
   */
  @Post('logout')
  @SignedIn()
  @HttpCode(204)
  @ApiBearerAuth()
  logout(@CurrentUser() user: AuthUser): Promise<void> {
    return this.auth.logout(user);
  }
}
