import { sql } from 'drizzle-orm';
import { jobLines } from './schema/index.js';

/**
 * "The line is done", kept off the index of status by the `+`: nearly every line of a shop's years is done,
 * so that index would walk them all. A query with it narrows by another index, such as `completed_at`.
 */
export const lineIsDone = sql`+${jobLines.status} = 'done'`;
