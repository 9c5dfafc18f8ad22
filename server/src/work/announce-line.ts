import type { JobLineDto } from '@baytime/shared';
import type { jobLines } from '../db/schema/index.js';
import type { FloorService } from '../floor/floor.service.js';
import type { LiveService } from '../live/live.service.js';
import { toJobLineDto } from './job-line.dto.js';

/** Tells the screens a line changed, once the use case commits: dispatch, the wall, and the kiosks it concerns. */
export function announceLine(
  line: typeof jobLines.$inferSelect,
  live: LiveService,
  floor: FloorService,
): JobLineDto {
  const jobLine = toJobLineDto(line);
  live.publish('job-line.updated', { jobLine }, floor.lineAudience(jobLine));
  floor.linesChanged([line.id]);
  floor.baysChanged();
  return jobLine;
}
