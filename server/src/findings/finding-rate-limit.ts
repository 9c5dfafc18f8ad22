import {
  HttpException,
  HttpStatus,
  Injectable,
  type CanActivate,
  type ExecutionContext,
  type OnApplicationShutdown,
} from '@nestjs/common';
import { ThrottlerStorageService } from '@nestjs/throttler';
import type { Response } from 'express';
import type { Principal } from '../auth/principal.js';

/** A technician records a few findings an hour; more than this in a minute is a stuck client or abuse. */
export const FINDINGS_PER_MINUTE = 10;
const MINUTE_MS = 60_000;

/**
 * Counts each person's finding uploads before the photos are read, so a flood is refused (429) before
 * it costs memory or decoding.
 */
@Injectable()
export class FindingRateLimit implements CanActivate, OnApplicationShutdown {
  private readonly hits = new ThrottlerStorageService();

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const http = context.switchToHttp();
    const { user } = http.getRequest<{ user: Principal }>();
    const { isBlocked, timeToBlockExpire } = await this.hits.increment(
      `finding:${user.id}`,
      MINUTE_MS,
      FINDINGS_PER_MINUTE,
      MINUTE_MS,
      'findings',
    );
    if (!isBlocked) return true;
    http.getResponse<Response>().setHeader('Retry-After', String(timeToBlockExpire));
    throw new HttpException(
      `More than ${FINDINGS_PER_MINUTE} findings in a minute: wait a moment, then send it again`,
      HttpStatus.TOO_MANY_REQUESTS,
    );
  }

  onApplicationShutdown(): void {
    this.hits.onApplicationShutdown();
  }
}
