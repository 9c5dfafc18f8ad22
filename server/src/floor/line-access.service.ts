import { ForbiddenException, Injectable } from '@nestjs/common';
import type { Principal } from '../auth/principal.js';
import type { jobLines } from '../db/schema/index.js';
import { FloorService } from './floor.service.js';

type LineRef = Pick<typeof jobLines.$inferSelect, 'id' | 'technicianId'>;

/**
 * Who may act on a job line from the floor. The foreman and owner act on any line; a technician on a
 * line assigned to them or one they are clocked on (a foreman may clock a helper on). Taking over
 * someone else's line is the foreman's call.
 */
@Injectable()
export class LineAccessService {
  constructor(private readonly floor: FloorService) {}

  isOn(line: LineRef, technicianId: number, now: Date): boolean {
    return (
      line.technicianId === technicianId ||
      (this.floor.stateOf(technicianId, now)?.openJobLineIds.includes(line.id) ?? false)
    );
  }

  /** Throws 403 unless the actor may work the line: hold, resume, finish, time it, record a finding. */
  assertMayWork(line: LineRef, actor: Principal, now: Date): void {
    if (actor.role === 'technician' && !this.isOn(line, actor.id, now))
      throw new ForbiddenException('That line is not yours: ask the foreman');
  }
}
