import type { Role } from '@morrowline/shared';
import type { ReactNode } from 'react';
import { NotAvailable } from '../../../components/NotAvailable';
import { ROLE_LABELS } from '../../../lib/roles';
import { useSignedInUser } from '../api/use-current-user';

interface RequireRoleProps {
  roles: readonly Role[];
  /** The screen's name, for the refusal message. */
  screen: string;
  homePath: string;
  children: ReactNode;
}

/**
 * A convenience for people, not a security check: the server refuses the same roles on its
 * routes. Someone who follows a link to a screen their role may not use gets a clear answer
 * instead of a screen full of 403s.
 */
export function RequireRole({ roles, screen, homePath, children }: RequireRoleProps) {
  const user = useSignedInUser();
  if (!roles.includes(user.role)) {
    return <NotAvailable screen={screen} roleLabel={ROLE_LABELS[user.role]} homePath={homePath} />;
  }
  return <>{children}</>;
}
