import { createParamDecorator, type ExecutionContext } from '@nestjs/common';
import type { Request } from 'express';

/** Where an answer came from, kept with it. */
export interface ClientInfo {
  ip: string;
  userAgent: string;
}

export const Client = createParamDecorator((_: unknown, context: ExecutionContext): ClientInfo => {
  const request = context.switchToHttp().getRequest<Request>();
  return { ip: request.ip ?? '', userAgent: (request.get('user-agent') ?? '').slice(0, 500) };
});

/** The scheme, host and port the office reached the server at: approval links use it by default. */
export const RequestOrigin = createParamDecorator((_: unknown, context: ExecutionContext): string => {
  const request = context.switchToHttp().getRequest<Request>();
  return `${request.protocol}://${request.get('host') ?? 'localhost'}`;
});
