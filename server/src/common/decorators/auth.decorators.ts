import { createParamDecorator, SetMetadata, type ExecutionContext } from '@nestjs/common';
import type { Role } from '@baytime/shared';
import type { Principal } from '../../auth/principal.js';

export const IS_PUBLIC = 'baytime:public';
export const ROLES_KEY = 'baytime:roles';

/** Opts a route out of the global sign-in guard. */
export const Public = () => SetMetadata(IS_PUBLIC, true);

/** Limits a route to these roles; without it any signed-in role passes. */
export const Roles = (...roles: Role[]) => SetMetadata(ROLES_KEY, roles);

export const CurrentUser = createParamDecorator(
  (_: unknown, context: ExecutionContext): Principal =>
    context.switchToHttp().getRequest<{ user: Principal }>().user,
);
