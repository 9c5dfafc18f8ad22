import { z } from 'zod';

export const idParamSchema = z.coerce.number().int().positive('An id is a positive whole number');
