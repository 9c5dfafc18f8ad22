import { ForbiddenException, Injectable, type ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import type { Request } from 'express';
import { INTEGRATION_KEY_PREFIX, type IntegrationScope, type Role } from '@baytime/shared';
import type { Principal } from '../../auth/principal.js';
import { IntegrationKeysService } from '../../integration-keys/integration-keys.service.js';
import type { KeyedRequest } from '../caller-context.js';
import { IS_PUBLIC, ROLES_KEY, SCOPE_KEY } from '../decorators/auth.decorators.js';

export const ROLE_REFUSAL = 'Your role cannot do that';

/**
 * Global: every route needs a valid token unless marked @Public(), and one of its @Roles() if given.
 * A socket message is the socket's own: its caller was set when the handshake was authenticated.
 * An integration key passes only on a route marked with a @Scope() the key holds.
 */
@Injectable()
export class SignedInGuard extends AuthGuard('jwt') {
  constructor(
    private readonly reflector: Reflector,
    private readonly keys: IntegrationKeysService,
  ) {
    super();
  }

  override async canActivate(context: ExecutionContext): Promise<boolean> {
    const targets = [context.getHandler(), context.getClass()];
    if (this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, targets)) return true;
    const roles = this.reflector.getAllAndOverride<Role[] | undefined>(ROLES_KEY, targets);
    if (context.getType() === 'ws') {
      const caller = context.switchToWs().getClient<{ data?: { principal?: Principal } }>().data?.principal;
      return caller !== undefined && (!roles || roles.includes(caller.role));
    }
    const request = context.switchToHttp().getRequest<Request & KeyedRequest & { user: Principal }>();
    const bearer = request.headers.authorization?.match(/^Bearer (\S+)$/)?.[1];
    if (bearer?.startsWith(INTEGRATION_KEY_PREFIX)) {
      const scope = this.reflector.getAllAndOverride<IntegrationScope | undefined>(SCOPE_KEY, targets);
      request.user = await this.keys.admit(bearer, scope, { method: request.method, path: request.path });
      request.integrationKey = request.user.integrationKey;
      return true;
    }
    await super.canActivate(context);
    if (roles && !roles.includes(request.user.role)) throw new ForbiddenException(ROLE_REFUSAL);
    return true;
  }

  override handleRequest<T>(error: unknown, user: T): T {
    if (error || !user) return super.handleRequest(error, user, undefined, undefined as never);
    return user;
  }
}
