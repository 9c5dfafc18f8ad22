import { BadRequestException, StandardSchemaValidationPipe } from '@nestjs/common';

/** Bodies, queries and params are checked by the zod schemas of `@baytime/shared`, field by field. */
export function validationPipe(): StandardSchemaValidationPipe {
  return new StandardSchemaValidationPipe({
    exceptionFactory: (issues) =>
      new BadRequestException({
        statusCode: 400,
        message: issues.map((issue) => issue.message).join('; '),
        issues: issues.map((issue) => ({
          path: (issue.path ?? []).map((part) => (typeof part === 'object' ? part.key : part)),
          message: issue.message,
        })),
      }),
  });
}
