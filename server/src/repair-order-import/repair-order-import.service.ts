import { HttpException, Injectable } from '@nestjs/common';
import type { ImportedRepairOrder, RepairOrderImportBody, RepairOrderImportResult } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { UnitOfWork } from '../db/unit-of-work.js';
import { RepairOrdersService } from '../work/repair-orders.service.js';
import { cellOf, readImportFile, type ImportGroup } from './read-import-file.js';

/** Thrown at the end of a preview's transaction so everything it wrote is rolled back. */
class PreviewOnly extends Error {}

/**
 * Imports ROs from a CSV file through the same use case as the intake form (`createOnce`), one RO per
 * transaction: an RO with any bad row is not saved at all, the others are. The preview runs the very
 * same writes and rolls them back, so it finds everything the import would refuse, down to an
 * odometer lower than the last visit, before anything is saved.
 */
@Injectable()
export class RepairOrderImportService {
  constructor(
    private readonly uow: UnitOfWork,
    private readonly repairOrders: RepairOrdersService,
  ) {}

  preview({ csv }: RepairOrderImportBody, actor: Principal): RepairOrderImportResult {
    return this.run(csv, actor, false);
  }

  import({ csv }: RepairOrderImportBody, actor: Principal): RepairOrderImportResult {
    return this.run(csv, actor, true);
  }

  private run(csv: string, actor: Principal, save: boolean): RepairOrderImportResult {
    const { groups, fileErrors } = readImportFile(csv);
    return { saved: save, fileErrors, repairOrders: groups.map((group) => this.write(group, actor, save)) };
  }

  private write(group: ImportGroup, actor: Principal, save: boolean): ImportedRepairOrder {
    const { externalRef, rows, customerName, vehicle, bookHours } = group;
    const summary = { externalRef, rows, customerName, vehicle, bookHours, lines: rows.length };
    const refused = (errors: ImportedRepairOrder['errors']): ImportedRepairOrder => ({
      ...summary,
      outcome: 'refused',
      repairOrderId: null,
      number: null,
      errors,
    });
    if (!group.body) return refused(group.errors);
    const body = group.body;
    let written: ReturnType<RepairOrdersService['createOnce']> | undefined;
    try {
      this.uow.run(() => {
        written = this.repairOrders.createOnce(body, actor);
        if (!save) throw new PreviewOnly();
      });
    } catch (error) {
      if (!(error instanceof PreviewOnly)) return refused(this.refusal(error, rows));
    }
    const { repairOrder, replayed } = written!;
    // A new RO in a preview was rolled back: its id and number are not kept.
    const kept = save || replayed;
    return {
      ...summary,
      outcome: replayed ? 'known' : 'new',
      repairOrderId: kept ? repairOrder.id : null,
      number: kept ? repairOrder.number : null,
      errors: [],
    };
  }

  /** The use case's 4xx answer, at the rows and columns its issues point to; anything else is a fault. */
  private refusal(error: unknown, rows: number[]): ImportedRepairOrder['errors'] {
    if (!(error instanceof HttpException) || error.getStatus() >= 500) throw error;
    const answer = error.getResponse() as {
      message?: string;
      issues?: { path: PropertyKey[]; message: string }[];
    };
    const issues = answer.issues ?? [{ path: [], message: answer.message ?? error.message }];
    return issues.map((issue) => cellOf(issue.path, rows, issue.message));
  }
}
