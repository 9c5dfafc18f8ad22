import { BadRequestException, NotFoundException } from '@nestjs/common';

export function foundOrFail<T>(row: T | undefined, what: string): T {
  if (row === undefined) throw new NotFoundException(`${what} not found`);
  return row;
}

/** An id in a request body that names nothing: the request is wrong (400), no page is missing (404). */
export function referencedOrFail<T>(row: T | undefined, what: string): T {
  if (row === undefined) throw new BadRequestException(`No ${what} with that id`);
  return row;
}

/** SQLite's unique-index violation, to answer 409 instead of 500. */
export function isUniqueViolation(error: unknown): boolean {
  return (error as { code?: string } | null)?.code === 'SQLITE_CONSTRAINT_UNIQUE';
}
