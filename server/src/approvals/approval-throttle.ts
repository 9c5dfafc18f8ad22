import {
  HttpException,
  HttpStatus,
  Injectable,
  NotFoundException,
  type CallHandler,
  type ExecutionContext,
  type NestInterceptor,
  type OnApplicationShutdown,
} from '@nestjs/common';
import { ThrottlerStorageService } from '@nestjs/throttler';
import type { Request, Response } from 'express';
import { catchError, throwError, type Observable } from 'rxjs';
import { clientAddressKey } from '../auth/client-address.js';
import { hashApprovalToken } from './approval-token.js';

const MINUTE_MS = 60_000;
/** A customer's page with its photos, reloaded now and then, stays far below these. */
export const APPROVAL_REQUESTS_PER_MINUTE = { address: 120, link: 60 };
/** Links that do not exist, from one address, before it must wait: the last of them starts the wait. */
export const APPROVAL_MISSES_ALLOWED = 10;
const MISS_WINDOW_MS = 10 * MINUTE_MS;
const MISS_BLOCK_MS = 15 * MINUTE_MS;

/**
 * Throttles the public approval routes: requests per address and per link, and, much harder, links
 * that do not exist. An address that tried too many wrong links waits, also for a right one.
 */
@Injectable()
export class ApprovalThrottle implements NestInterceptor, OnApplicationShutdown {
  private readonly hits = new ThrottlerStorageService();
  private readonly blockedUntil = new Map<string, number>();

  async intercept(context: ExecutionContext, next: CallHandler): Promise<Observable<unknown>> {
    const http = context.switchToHttp();
    const request = http.getRequest<Request<{ token?: string }>>();
    const response = http.getResponse<Response>();
    const address = clientAddressKey(request.ip);

    const blocked = this.blockedUntil.get(address);
    if (blocked !== undefined) {
      if (blocked > Date.now()) this.refuse(response, blocked - Date.now());
      this.blockedUntil.delete(address);
    }
    await this.count(`address:${address}`, APPROVAL_REQUESTS_PER_MINUTE.address, response);
    const token = String(request.params.token ?? '');
    await this.count(`link:${hashApprovalToken(token)}`, APPROVAL_REQUESTS_PER_MINUTE.link, response);

    return next.handle().pipe(
      catchError((error: unknown) => {
        if (error instanceof NotFoundException) return this.miss(address, error);
        return throwError(() => error);
      }),
    );
  }

  onApplicationShutdown(): void {
    this.hits.onApplicationShutdown();
  }

  private async miss(address: string, error: NotFoundException): Promise<never> {
    const { isBlocked, timeToBlockExpire } = await this.hits.increment(
      `miss:${address}`,
      MISS_WINDOW_MS,
      // The storage blocks once the hits exceed the limit: the last allowed miss is the one that does.
      APPROVAL_MISSES_ALLOWED - 1,
      MISS_BLOCK_MS,
      'approval-misses',
    );
    if (isBlocked) this.blockedUntil.set(address, Date.now() + timeToBlockExpire * 1000);
    throw error;
  }

  private async count(key: string, limit: number, response: Response): Promise<void> {
    const { isBlocked, timeToBlockExpire } = await this.hits.increment(
      key,
      MINUTE_MS,
      limit,
      MINUTE_MS,
      'approvals',
    );
    if (isBlocked) this.refuse(response, timeToBlockExpire * 1000);
  }

  private refuse(response: Response, waitMs: number): never {
    response.setHeader('Retry-After', String(Math.ceil(waitMs / 1000)));
    throw new HttpException(
      'Too many tries: wait a few minutes, then open the link again',
      HttpStatus.TOO_MANY_REQUESTS,
    );
  }
}
