import type { ExceptionList, ReviewExceptionBody } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { useResolution } from './resolve';

/** `POST /api/exceptions/reviews`: the foreman checked a timecard exception and accepts it as it is. */
export function reviewException(body: ReviewExceptionBody): Promise<ExceptionList> {
  return officeApi.post<ExceptionList>('/exceptions/reviews', body);
}

export const useReviewException = () => useResolution(reviewException);
