import type { z } from 'zod';
import { pageQuerySchema, type Page } from '../paging/page.schema.js';
import { findingsQuerySchema, type FindingDto } from './findings.schema.js';

/** `GET /api/findings`: newest first, a page at a time. */
export const findingsPageQuerySchema = findingsQuerySchema.extend(pageQuerySchema.shape);
export type FindingsPageQuery = z.infer<typeof findingsPageQuerySchema>;
export type FindingsPage = Page<FindingDto>;
