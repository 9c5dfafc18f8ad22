import { HttpException, HttpStatus } from '@nestjs/common';

/** A refusal that says when to come back: the errors filter adds the `Retry-After` header. */
export class RetryLaterException extends HttpException {
  constructor(
    message: string,
    readonly retryAfterSeconds: number,
  ) {
    super({ statusCode: HttpStatus.TOO_MANY_REQUESTS, message }, HttpStatus.TOO_MANY_REQUESTS);
  }
}
