import { ROLES } from '@morrowline/shared';
import { ROLE_LABELS } from '../../lib/roles';

export const ROLE_OPTIONS = ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));

/** Same floor as the server's CreateUserRequest validation. */
export const MIN_PASSWORD_LENGTH = 10;
