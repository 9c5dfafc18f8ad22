import { isOpenLine, type JobLineStatus } from './work.schema.js';

export interface LateCheckLine {
  status: JobLineStatus;
  promisedAt: Date | string | null;
}

/**
 * The one definition of late work, for dispatch, the wall and the RO pages alike: an open line whose
 * promised time has passed, or whose forecast (a waiting line's: if started now at the shop's pace)
 * finishes after it. A held line has no forecast: it is late once its promise has passed.
 */
export function isLineLate(line: LateCheckLine, forecast: { late: boolean } | null, now: Date): boolean {
  if (!isOpenLine(line) || line.promisedAt === null) return false;
  return new Date(line.promisedAt).getTime() < now.getTime() || (forecast?.late ?? false);
}
