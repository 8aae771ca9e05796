import { SetMetadata } from '@nestjs/common';
import { ROLES, type Role } from '@shuntwise/contracts';

export const ROLES_KEY = 'shuntwise:roles';

/** The roles that may call a route (or every route of a controller). */
export const Roles = (...roles: Role[]) => SetMetadata(ROLES_KEY, roles);

/** Any signed-in user, whatever the role. */
export const AnyRole = () => Roles(...ROLES);
