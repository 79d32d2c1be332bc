import { type CanActivate, type ExecutionContext, ForbiddenException, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Role } from '@morrowline/shared';
import type { AuthUser } from '../../common/auth-user';
import { PUBLIC_KEY, ROLES_KEY } from '../../common/decorators/roles.decorator';

/**
 * Every non-public route must say which roles may call it; a route that says nothing is refused,
 * so a forgotten decorator fails closed.
 */
@Injectable()
export class RolesGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(context: ExecutionContext): boolean {
    if (context.getType() !== 'http') return true;
    const targets = [context.getHandler(), context.getClass()];
    if (this.reflector.getAllAndOverride<boolean>(PUBLIC_KEY, targets)) return true;
    const allowed = this.reflector.getAllAndOverride<Role[] | undefined>(ROLES_KEY, targets);
    const user = context.switchToHttp().getRequest<{ user?: AuthUser }>().user;
    if (!user) return false;
    if (!allowed || !allowed.includes(user.role)) {
      throw new ForbiddenException(`Your role (${user.role}) may not do this`);
    }
    return true;
  }
}
