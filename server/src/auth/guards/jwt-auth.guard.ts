import { type ExecutionContext, HttpException, Injectable, UnauthorizedException } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import { PUBLIC_KEY } from '../../common/decorators/roles.decorator';
import { TOKEN_MESSAGES } from '../token-check';

/** Applied to every route (APP_GUARD); @Public() opts a route out. */
@Injectable()
export class JwtAuthGuard extends AuthGuard('jwt') {
  constructor(private readonly reflector: Reflector) {
    super();
  }

  override canActivate(context: ExecutionContext) {
    const isPublic = this.reflector.getAllAndOverride<boolean>(PUBLIC_KEY, [context.getHandler(), context.getClass()]);
    if (isPublic) return true;
    return super.canActivate(context);
  }

  override handleRequest<TUser>(error: unknown, user: TUser | false, info: unknown): TUser {
    // The strategy's own answers (session ended, account inactive, database unreachable: 503)
    // pass as they are; anything else unexpected is the server's fault, not the token's.
    if (error instanceof HttpException) throw error;
    if (error) throw error;
    if (!user) throw new UnauthorizedException(tokenMessage(info));
    return user;
  }
}

/** passport-jwt's `info`: no token at all, an expired one, or one that does not verify. */
function tokenMessage(info: unknown): string {
  if (!(info instanceof Error)) return TOKEN_MESSAGES.missing;
  if (info.name === 'TokenExpiredError') return TOKEN_MESSAGES.expired;
  if (info.name === 'JsonWebTokenError' || info.name === 'NotBeforeError') return TOKEN_MESSAGES.invalid;
  return TOKEN_MESSAGES.missing;
}
