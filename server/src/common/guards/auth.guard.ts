import {
  ForbiddenException,
  Injectable,
  UnauthorizedException,
  type CanActivate,
  type ExecutionContext,
} from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Request } from 'express';
import { INTEGRATION_KEY_PREFIX, type IntegrationScope, type Role } from '@baytime/shared';
import { AuthService } from '../../auth/auth.service.js';
import type { Principal } from '../../auth/principal.js';
import { IntegrationKeysService } from '../../integration-keys/integration-keys.service.js';
import type { KeyedRequest } from '../caller-context.js';
import { IS_PUBLIC, ROLES_KEY, SCOPE_KEY } from '../decorators/auth.decorators.js';

export const ROLE_REFUSAL = 'Your role cannot do that';

/** `<scheme> <credentials>`, the scheme in any case, as the `Authorization` header is read for a token. */
const AUTHORIZATION = /(\S+)\s+(\S+)/;

/**
 * Global: every route needs a valid token unless marked @Public(), and one of its @Roles() if given.
 * A socket message is the socket's own: its caller was set when the handshake was authenticated.
 * An integration key passes only on a route marked with a @Scope() the key holds.
 *
 * A token is checked as the live socket checks it (AuthService.check: HS256 only, an expiry required
 * and not passed, the caller still active in the role it was signed for); any refusal answers a bare
 * 401 `Unauthorized`.
 */
@Injectable()
export class SignedInGuard implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    private readonly auth: AuthService,
    private readonly keys: IntegrationKeysService,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const targets = [context.getHandler(), context.getClass()];
    if (this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, targets)) return true;
    const roles = this.reflector.getAllAndOverride<Role[] | undefined>(ROLES_KEY, targets);
    if (context.getType() === 'ws') {
      const caller = context.switchToWs().getClient<{ data?: { principal?: Principal } }>().data?.principal;
      return caller !== undefined && (!roles || roles.includes(caller.role));
    }
    const request = context.switchToHttp().getRequest<Request & KeyedRequest & { user: Principal }>();
    const bearer = bearerToken(request.headers.authorization);
    if (bearer?.startsWith(INTEGRATION_KEY_PREFIX)) {
      const scope = this.reflector.getAllAndOverride<IntegrationScope | undefined>(SCOPE_KEY, targets);
      request.user = await this.keys.admit(bearer, scope, { method: request.method, path: request.path });
      request.integrationKey = request.user.integrationKey;
      return true;
    }
    const checked = this.auth.check(bearer);
    if (!('principal' in checked)) throw new UnauthorizedException();
    request.user = checked.principal;
    if (roles && !roles.includes(request.user.role)) throw new ForbiddenException(ROLE_REFUSAL);
    return true;
  }
}

export function bearerToken(header: string | undefined): string | undefined {
  const parts = header?.match(AUTHORIZATION);
  return parts?.[1]?.toLowerCase() === 'bearer' ? parts[2] : undefined;
}
