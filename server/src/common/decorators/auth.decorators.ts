import {
  applyDecorators,
  createParamDecorator,
  SetMetadata,
  UseInterceptors,
  type ExecutionContext,
} from '@nestjs/common';
import type { IntegrationScope, Role } from '@baytime/shared';
import type { Principal } from '../../auth/principal.js';
import { CallerContextInterceptor } from '../caller-context.js';

export const IS_PUBLIC = 'baytime:public';
export const ROLES_KEY = 'baytime:roles';
export const SCOPE_KEY = 'baytime:integration-scope';

/** Opts a route out of the global sign-in guard. */
export const Public = () => SetMetadata(IS_PUBLIC, true);

/** Limits a route to these roles; without it any signed-in role passes. */
export const Roles = (...roles: Role[]) => SetMetadata(ROLES_KEY, roles);

/**
 * Lets an integration key holding this scope call the route too. A route without it refuses every key,
 * so a key can never sign in to the apps or act as a person. Only such a route runs its handler with
 * the calling key at hand, so the other routes skip that interceptor's round.
 */
export const Scope = (scope: IntegrationScope) =>
  applyDecorators(SetMetadata(SCOPE_KEY, scope), UseInterceptors(CallerContextInterceptor));

export const CurrentUser = createParamDecorator(
  (_: unknown, context: ExecutionContext): Principal =>
    context.switchToHttp().getRequest<{ user: Principal }>().user,
);
