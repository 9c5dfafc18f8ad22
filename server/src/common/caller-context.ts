import { AsyncLocalStorage } from 'node:async_hooks';
import { Injectable, type CallHandler, type ExecutionContext, type NestInterceptor } from '@nestjs/common';
import type { Observable } from 'rxjs';

/** The integration key a request came with, if any. */
export interface CallingKey {
  id: number;
  name: string;
}

export interface KeyedRequest {
  integrationKey?: CallingKey;
}

const calls = new AsyncLocalStorage<CallingKey | undefined>();

/** The key of the request being handled; undefined for a person's request or outside one. */
export function callingKey(): CallingKey | undefined {
  return calls.getStore();
}

/**
 * On every route an integration key may call (see @Scope): runs the HTTP handler with the key the
 * guard admitted, so whatever the use case writes (audit rows first) is marked as the key's doing
 * without every service passing it along.
 */
@Injectable()
export class CallerContextInterceptor implements NestInterceptor {
  intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
    if (context.getType() !== 'http') return next.handle();
    const key = context.switchToHttp().getRequest<KeyedRequest>().integrationKey;
    // A person's request has no store to set: no request runs inside another's.
    if (!key) return next.handle();
    // next.handle() binds the handler to the context it is called in.
    return calls.run(key, () => next.handle());
  }
}
