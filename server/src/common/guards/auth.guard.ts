import { ForbiddenException, Injectable, type ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import type { Role } from '@baytime/shared';
import type { Principal } from '../../auth/principal.js';
import { IS_PUBLIC, ROLES_KEY } from '../decorators/auth.decorators.js';

export const ROLE_REFUSAL = 'Your role cannot do that';

/**
 * Global: every route needs a valid token unless marked @Public(), and one of its @Roles() if given.
 * A socket message is the socket's own: its caller was set when the handshake was authenticated.
 */
@Injectable()
export class SignedInGuard extends AuthGuard('jwt') {
  constructor(private readonly reflector: Reflector) {
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
    await super.canActivate(context);
    const user = context.switchToHttp().getRequest<{ user: Principal }>().user;
    if (roles && !roles.includes(user.role)) throw new ForbiddenException(ROLE_REFUSAL);
    return true;
  }

  override handleRequest<T>(error: unknown, user: T): T {
    if (error || !user) return super.handleRequest(error, user, undefined, undefined as never);
    return user;
  }
}
