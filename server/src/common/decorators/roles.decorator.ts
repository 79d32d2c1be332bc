import { SetMetadata } from '@nestjs/common';
import { PERMISSIONS, type Role } from '@morrowline/shared';

export const ROLES_KEY = 'morrowline:roles';
export const PUBLIC_KEY = 'morrowline:public';

/** Only these roles may call the route (checked by RolesGuard), e.g. `@Roles(...PERMISSIONS.forecast)`. */
export const Roles = (...roles: Role[]) => SetMetadata(ROLES_KEY, roles);

/** Any signed-in user may call the route. Routes without @Roles or @Public are refused (403). */
export const SignedIn = () => SetMetadata(ROLES_KEY, PERMISSIONS.signedIn);

/** No token needed (sign-in, health, docs). */
export const Public = () => SetMetadata(PUBLIC_KEY, true);
