import { ConflictException, Inject, Injectable, Logger, type StreamableFile } from '@nestjs/common';
import { and, asc, count, desc, eq, inArray, max, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import {
  inSentence,
  JOB_LINE_STATUS_WORDS,
  FINDING_ANSWER_WORDS,
  findingPrice,
  normalisePhone,
  type ApprovalLinkDto,
  type ApprovalLinkStatus,
  type ChangeFindingAnswerBody,
  type CreateFindingBody,
  type FindingAnswerBody,
  type FindingQuoteBody,
  type FindingAnswerResult,
  type FindingDto,
  type FindingsPage,
  type FindingsPageQuery,
  type JobLineDto,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { describeVehicle } from '../floor/describe-vehicle.js';
import { foundOrFail } from '../common/not-found.js';
import { decodeCursor, olderThan, toPage } from '../common/paging.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import {
  approvalLinkFindings,
  approvalLinks,
  attachments,
  auditLog,
  customers,
  findings,
  jobLines,
  repairOrders,
  users,
  vehicles,
} from '../db/schema/index.js';
import { FloorService } from '../floor/floor.service.js';
import { LineAccessService } from '../floor/line-access.service.js';
import { LiveService } from '../live/live.service.js';
import { toJobLineDto } from '../work/job-line.dto.js';
import { JobLinesService } from '../work/job-lines.service.js';
import { ShopService } from '../shop/shop.service.js';
import { syncRepairOrderStatus } from '../work/repair-order-status.js';
import { concernFromNote, titleFromNote } from './finding-words.js';
import { NoticesService } from './notices.service.js';
import { PhotoStore, type StoredPhoto } from './photo-store.js';
import type { UploadedPhoto } from './photo-upload.js';
import { WebhookOutbox } from '../webhooks/webhook-outbox.service.js';

type LineRow = typeof jobLines.$inferSelect;
type AttachmentRow = typeof attachments.$inferSelect;

const OFFICE_ROLES: Principal['role'][] = ['owner', 'foreman', 'advisor'];

/** What the customer decided about one finding. */
export type AnswerDecision =
  { answer: 'approved'; bookHours: number; title?: string } | { answer: 'declined'; note?: string };

/**
 * Where an answer came from. The office records phone and in-person answers; a link answer is the
 * customer's own, signed by name, and the line changes that follow are made for the advisor who sent it.
 */
export type AnswerSource =
  | { channel: 'phone' | 'in-person'; actor: Principal }
  | { channel: 'link'; linkId: number; signedName: string; actor: Principal };
/** Extra work a technician found: photos, the office inbox, and the answer once the customer decided. */
@Injectable()
export class FindingsService {
  private readonly logger = new Logger('Findings');

  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly live: LiveService,
    private readonly floor: FloorService,
    private readonly access: LineAccessService,
    private readonly lines: JobLinesService,
    private readonly photos: PhotoStore,
    private readonly notices: NoticesService,
    private readonly shop: ShopService,
    private readonly webhooks: WebhookOutbox,
  ) {}

  async create(
    jobLineId: number,
    body: CreateFindingBody,
    uploaded: UploadedPhoto[],
    actor: Principal,
  ): Promise<FindingDto> {
    this.lineFor(jobLineId, body, actor, new Date());
    const checked = await this.photos.check(uploaded);
    const stored = await this.photos.write(checked);
    // From here on nothing awaits: the checks, the rows and the hold see one state of the line.
    let findingId: number;
    try {
      findingId = this.uow.run(() => this.record(jobLineId, body, stored, actor, new Date()));
    } catch (error) {
      await this.photos.remove(stored.flatMap((photo) => [photo.storedName, photo.previewName]));
      throw error;
    }
    try {
      this.notices.findingCreated(findingId);
    } catch (error) {
      this.logger.error(`Could not queue the advisor's e-mail for finding ${findingId}: ${String(error)}`);
    }
    return this.get(findingId);
  }

  /** The finding, its photos, the hold and the audit row: one transaction. */
  private record(
    jobLineId: number,
    body: CreateFindingBody,
    stored: StoredPhoto[],
    actor: Principal,
    now: Date,
  ): number {
    const line = this.lineFor(jobLineId, body, actor, now);
    const finding = this.db
      .insert(findings)
      .values({
        jobLineId: line.id,
        technicianId: actor.id,
        note: body.note,
        severity: body.severity,
        suggestedHours: body.suggestedHours ?? null,
        createdAt: now,
      })
      .returning()
      .get();
    for (const photo of stored)
      this.db
        .insert(attachments)
        .values({ ...photo, findingId: finding.id, createdAt: now })
        .run();
    if (body.holdForApproval) this.lines.hold(jobLineId, { reason: 'approval' }, actor, now);
    this.audit.record({
      actorId: actor.id,
      action: 'create',
      entity: 'finding',
      entityId: finding.id,
      detail: {
        jobLineId,
        severity: body.severity,
        photos: stored.length,
        holdForApproval: body.holdForApproval,
      },
    });
    this.live.publish('finding.created', { findingId: finding.id, jobLineId });
    return finding.id;
  }

  /** One page, newest first. */
  list(query: FindingsPageQuery): FindingsPage {
    const where = and(
      query.answer ? eq(findings.answer, query.answer) : undefined,
      query.repairOrderId ? eq(jobLines.repairOrderId, query.repairOrderId) : undefined,
    );
    const total =
      this.db
        .select({ n: count() })
        .from(findings)
        .innerJoin(jobLines, eq(jobLines.id, findings.jobLineId))
        .where(where)
        .get()?.n ?? 0;
    const after = olderThan(findings.createdAt, findings.id, decodeCursor(query.cursor));
    return toPage(
      this.dtos(and(where, after), query.limit + 1),
      query.limit,
      total,
      (finding) => ({ at: Date.parse(finding.createdAt), id: finding.id }),
      (shown) => shown,
    );
  }

  get(id: number): FindingDto {
    return foundOrFail(this.dtos(eq(findings.id, id), 1)[0], 'Finding');
  }

  /** An answer the office records: the customer said it by phone or in person. */
  @Transactional()
  answer(id: number, body: FindingAnswerBody, actor: Principal, now = new Date()): FindingAnswerResult {
    const { channel, ...decision } = body;
    return this.recordAnswer(id, decision, { channel, actor }, now);
  }

  /**
   * Records the customer's answer, whatever its channel: the one place an answer is written. A yes
   * adds a queued line to the RO; a no is noted on it. Either way a line held for approval goes back
   * to the queue once no finding on it waits for an answer.
   */
  @Transactional()
  recordAnswer(
    id: number,
    decision: AnswerDecision,
    source: AnswerSource,
    now = new Date(),
  ): FindingAnswerResult {
    const finding = foundOrFail(this.db.select().from(findings).where(eq(findings.id, id)).get(), 'Finding');
    if (finding.answer !== 'pending') throw new ConflictException('That finding was already answered');
    const line = foundOrFail(
      this.db.select().from(jobLines).where(eq(jobLines.id, finding.jobLineId)).get(),
      'Job line',
    );
    const ro = foundOrFail(
      this.db.select().from(repairOrders).where(eq(repairOrders.id, line.repairOrderId)).get(),
      'Repair order',
    );
    if (decision.answer === 'approved' && ro.status === 'closed')
      throw new ConflictException('That repair order is closed: open a new one for the extra work');

    let created: LineRow | null = null;
    if (decision.answer === 'approved') {
      const last = this.db
        .select({ lineNo: max(jobLines.lineNo) })
        .from(jobLines)
        .where(eq(jobLines.repairOrderId, ro.id))
        .get();
      created = this.db
        .insert(jobLines)
        .values({
          repairOrderId: ro.id,
          lineNo: (last?.lineNo ?? 0) + 1,
          title: decision.title ?? titleFromNote(finding.customerWording ?? finding.note),
          concern: concernFromNote(finding.note),
          bookHours: decision.bookHours,
          skillLevel: line.skillLevel,
          status: 'queued',
          priority: finding.severity === 'safety-now' ? 'high' : 'normal',
          bayId: line.bayId,
          promisedAt: ro.promisedAt,
          queuedAt: now,
          updatedAt: now,
        })
        .returning()
        .get();
    }
    const byLink = source.channel === 'link';
    this.db
      .update(findings)
      .set({
        answer: decision.answer,
        answerChannel: source.channel,
        answeredBy: byLink ? null : source.actor.id,
        answeredName: byLink ? source.signedName : null,
        answeredAt: now,
        createdLineId: created?.id,
      })
      .where(eq(findings.id, id))
      .run();

    const actorId = byLink ? null : source.actor.id;
    const origin = byLink
      ? { channel: source.channel, linkId: source.linkId, signedName: source.signedName }
      : { channel: source.channel };
    this.audit.record(
      {
        actorId,
        action: decision.answer === 'approved' ? 'approve' : 'decline',
        entity: 'finding',
        entityId: id,
        detail: { ...decision, ...origin, createdLineId: created?.id ?? null },
      },
      now,
    );
    this.audit.record(
      {
        actorId,
        action: decision.answer === 'approved' ? 'finding-approved' : 'finding-declined',
        entity: 'repair-order',
        entityId: ro.id,
        detail:
          decision.answer === 'approved'
            ? {
                findingId: id,
                jobLineId: created?.id,
                title: created?.title,
                bookHours: decision.bookHours,
                ...origin,
              }
            : { findingId: id, note: decision.note ?? null, ...origin },
      },
      now,
    );

    syncRepairOrderStatus(this.db, ro.id);
    this.live.publish('repair-order.updated', { repairOrderId: ro.id });
    this.webhooks.announce(
      'finding.answered',
      {
        findingId: id,
        jobLineId: line.id,
        repairOrderId: ro.id,
        answer: decision.answer,
        answeredAt: now.toISOString(),
        createdLineId: created?.id ?? null,
      },
      now,
    );

    let createdLine: JobLineDto | null = null;
    if (created) {
      createdLine = toJobLineDto(created);
      this.live.publish('job-line.updated', { jobLine: createdLine }, this.floor.lineAudience(createdLine));
      this.floor.linesChanged([created.id]);
    }
    this.live.publish(
      'finding.answered',
      {
        findingId: id,
        jobLineId: line.id,
        note: finding.note,
        answer: decision.answer,
        channel: source.channel,
      },
      // The line's technician's kiosk quotes the finding in its notice of why a held line is back.
      this.floor.lineAudience(line, now),
    );
    return {
      finding: this.get(id),
      createdLine,
      resumedLine: this.resumeIfAnswered(line.id, source.actor, now),
    };
  }

  /** The advisor's quote: the words the customer reads, the hours and the parts. */
  @Transactional()
  quote(id: number, body: FindingQuoteBody, actor: Principal): FindingDto {
    const finding = foundOrFail(this.db.select().from(findings).where(eq(findings.id, id)).get(), 'Finding');
    if (finding.answer !== 'pending') throw new ConflictException('That finding was already answered');
    const quote = {
      customerWording: body.customerWording,
      bookHours: body.bookHours,
      partsCents: body.partsCents ?? null,
    };
    this.db.update(findings).set(quote).where(eq(findings.id, id)).run();
    this.audit.record({ actorId: actor.id, action: 'quote', entity: 'finding', entityId: id, detail: quote });
    const dto = this.get(id);
    this.live.publish('repair-order.updated', { repairOrderId: dto.repairOrderId });
    return dto;
  }

  /**
   * Changes a recorded answer, with a reason. No to yes adds the line a yes adds; yes to no cancels
   * the line the yes added, which is refused once that line is done.
   */
  @Transactional()
  changeAnswer(
    id: number,
    body: ChangeFindingAnswerBody,
    actor: Principal,
    now = new Date(),
  ): FindingAnswerResult {
    const finding = foundOrFail(this.db.select().from(findings).where(eq(findings.id, id)).get(), 'Finding');
    if (finding.answer === 'pending')
      throw new ConflictException('That finding has no answer yet: answer it');
    if (finding.answer === body.answer)
      throw new ConflictException(`That finding is already ${inSentence(FINDING_ANSWER_WORDS[body.answer])}`);
    const line = this.db.select().from(jobLines).where(eq(jobLines.id, finding.jobLineId)).get()!;
    let createdLine: JobLineDto | null = null;
    if (body.answer === 'declined' && finding.createdLineId !== null) {
      const added = this.db.select().from(jobLines).where(eq(jobLines.id, finding.createdLineId)).get();
      if (added?.status === 'done')
        throw new ConflictException('The work the yes added is done already: the answer stays');
      if (added && added.status !== 'cancelled')
        this.lines.cancel(added.id, { reason: `Customer's answer changed: ${body.reason}` }, actor, now);
      this.db
        .update(findings)
        .set({ answer: 'declined', createdLineId: null })
        .where(eq(findings.id, id))
        .run();
    }
    if (body.answer === 'approved') {
      this.db.update(findings).set({ answer: 'pending' }).where(eq(findings.id, id)).run();
      createdLine = this.recordAnswer(
        id,
        { answer: 'approved', bookHours: body.bookHours, title: body.title },
        { channel: body.channel, actor },
        now,
      ).createdLine;
    }
    this.db
      .update(findings)
      .set({ answeredBy: actor.id, answeredName: null, answerChannel: body.channel, answeredAt: now })
      .where(eq(findings.id, id))
      .run();
    this.audit.record(
      {
        actorId: actor.id,
        action: 'finding-answer-changed',
        entity: 'repair-order',
        entityId: line.repairOrderId,
        detail: { findingId: id, from: finding.answer, answer: body.answer, reason: body.reason },
      },
      now,
    );
    this.live.publish('repair-order.updated', { repairOrderId: line.repairOrderId });
    return { finding: this.get(id), createdLine, resumedLine: null };
  }

  /**
   * A photo or its preview, to the office and to technicians on that repair order. A photo the actor
   * may not see answers exactly as one that does not exist, so ids reveal nothing.
   */
  photo(id: number, variant: 'original' | 'preview', actor: Principal): StreamableFile {
    const found = this.db
      .select({ attachment: attachments, finding: findings, repairOrderId: jobLines.repairOrderId })
      .from(attachments)
      .innerJoin(findings, eq(findings.id, attachments.findingId))
      .innerJoin(jobLines, eq(jobLines.id, findings.jobLineId))
      .where(eq(attachments.id, id))
      .get();
    const { attachment, finding } = foundOrFail(
      found && this.maySeePhotosOf(found.finding, found.repairOrderId, actor) ? found : undefined,
      'Photo',
    );
    const number = `finding-${finding.id}-photo-${attachment.id}`;
    return variant === 'preview' && attachment.previewName
      ? this.photos.stream(attachment.previewName, 'image/jpeg', `${number}-preview.jpg`)
      : this.photos.stream(
          attachment.storedName,
          attachment.mimeType,
          `${number}.${extensionOf(attachment)}`,
        );
  }

  /**
   * The line the finding is for, when the actor may record one on it: the foreman and owner on any
   * line; a technician on a line assigned to them or one they are clocked on.
   */
  private lineFor(jobLineId: number, body: CreateFindingBody, actor: Principal, now: Date): LineRow {
    const line = foundOrFail(
      this.db.select().from(jobLines).where(eq(jobLines.id, jobLineId)).get(),
      'Job line',
    );
    this.access.assertMayWork(line, actor, now);
    if (
      body.holdForApproval &&
      line.status !== 'queued' &&
      line.status !== 'working' &&
      line.status !== 'held'
    )
      throw new ConflictException(
        `That line is already ${inSentence(JOB_LINE_STATUS_WORDS[line.status])}: it cannot be held for approval`,
      );
    return line;
  }

  private maySeePhotosOf(
    finding: { technicianId: number },
    repairOrderId: number,
    actor: Principal,
  ): boolean {
    if (OFFICE_ROLES.includes(actor.role)) return true;
    return (
      actor.role === 'technician' &&
      (finding.technicianId === actor.id || this.onRepairOrder(repairOrderId, actor.id))
    );
  }

  private onRepairOrder(repairOrderId: number, technicianId: number): boolean {
    return !!this.db
      .select({ id: jobLines.id })
      .from(jobLines)
      .where(and(eq(jobLines.repairOrderId, repairOrderId), eq(jobLines.technicianId, technicianId)))
      .get();
  }

  private resumeIfAnswered(jobLineId: number, actor: Principal, now: Date): JobLineDto | null {
    const line = this.db.select().from(jobLines).where(eq(jobLines.id, jobLineId)).get();
    if (line?.status !== 'held' || line.holdReason !== 'approval') return null;
    const waiting = this.db
      .select({ id: findings.id })
      .from(findings)
      .where(and(eq(findings.jobLineId, jobLineId), eq(findings.answer, 'pending')))
      .get();
    return waiting ? null : this.lines.resume(jobLineId, actor, now);
  }

  /** The last link sent for each finding. */
  private lastLinks(findingIds: number[], now: Date): Map<number, ApprovalLinkDto> {
    const rows = this.db
      .select({ findingId: approvalLinkFindings.findingId, link: approvalLinks })
      .from(approvalLinkFindings)
      .innerJoin(approvalLinks, eq(approvalLinks.id, approvalLinkFindings.linkId))
      .where(inArray(approvalLinkFindings.findingId, findingIds))
      .orderBy(asc(approvalLinks.id))
      .all();
    return new Map(rows.map(({ findingId, link }) => [findingId, toApprovalLinkDto(link, now)]));
  }

  private dtos(where: SQL | undefined, limit: number): FindingDto[] {
    const answerer = alias(users, 'answerer');
    const rows = this.db
      .select({
        finding: findings,
        line: jobLines,
        ro: repairOrders,
        vehicle: vehicles,
        customer: customers,
        technicianName: users.name,
        answeredBy: answerer.name,
      })
      .from(findings)
      .innerJoin(jobLines, eq(jobLines.id, findings.jobLineId))
      .innerJoin(repairOrders, eq(repairOrders.id, jobLines.repairOrderId))
      .innerJoin(vehicles, eq(vehicles.id, repairOrders.vehicleId))
      .innerJoin(customers, eq(customers.id, repairOrders.customerId))
      .innerJoin(users, eq(users.id, findings.technicianId))
      .leftJoin(answerer, eq(answerer.id, findings.answeredBy))
      .where(where)
      .orderBy(desc(findings.createdAt), desc(findings.id))
      .limit(limit)
      .all();
    if (!rows.length) return [];
    const ids = rows.map((row) => row.finding.id);
    const photos = this.db
      .select()
      .from(attachments)
      .where(inArray(attachments.findingId, ids))
      .orderBy(asc(attachments.id))
      .all();
    const notes = this.db
      .select({
        entityId: auditLog.entityId,
        action: auditLog.action,
        at: auditLog.at,
        detail: auditLog.detail,
      })
      .from(auditLog)
      .where(
        and(
          eq(auditLog.entity, 'finding'),
          inArray(auditLog.entityId, ids.map(String)),
          inArray(auditLog.action, ['decline', 'request-approval']),
        ),
      )
      .orderBy(asc(auditLog.at), asc(auditLog.id))
      .all();
    const links = this.lastLinks(ids, new Date());
    const { labourRateCents } = this.shop.settings();
    const lastNote = (findingId: number, action: string) =>
      notes.filter((note) => note.entityId === String(findingId) && note.action === action).at(-1);

    return rows.map(({ finding, line, ro, vehicle, customer, technicianName, answeredBy }) => {
      const declined = lastNote(finding.id, 'decline')?.detail?.note;
      return {
        id: finding.id,
        jobLineId: line.id,
        lineNo: line.lineNo,
        lineTitle: line.title,
        lineStatus: line.status,
        holdReason: line.holdReason,
        repairOrderId: ro.id,
        repairOrderNumber: ro.number,
        vehicle: describeVehicle(vehicle),
        customerName: customer.name,
        customerHasEmail: !!customer.email?.trim(),
        customerHasMobile: !!customer.phone && normalisePhone(customer.phone) !== null,
        technicianId: finding.technicianId,
        technicianName,
        note: finding.note,
        severity: finding.severity,
        suggestedHours: finding.suggestedHours,
        customerWording: finding.customerWording,
        bookHours: finding.bookHours,
        partsCents: finding.partsCents,
        priceCents:
          finding.bookHours === null
            ? null
            : findingPrice(finding.bookHours, labourRateCents, finding.partsCents).priceCents,
        answer: finding.answer,
        answerChannel: finding.answerChannel,
        answeredBy: answeredBy ?? finding.answeredName ?? null,
        answeredAt: finding.answeredAt?.toISOString() ?? null,
        answerNote: typeof declined === 'string' ? declined : null,
        createdLineId: finding.createdLineId,
        approvalRequestedAt: lastNote(finding.id, 'request-approval')?.at.toISOString() ?? null,
        approvalLink: links.get(finding.id) ?? null,
        createdAt: finding.createdAt.toISOString(),
        photos: photos
          .filter((photo) => photo.findingId === finding.id)
          .map((photo) => ({
            id: photo.id,
            mimeType: photo.mimeType as FindingDto['photos'][number]['mimeType'],
            sizeBytes: photo.sizeBytes,
            url: `/api/attachments/${photo.id}`,
            previewUrl: `/api/attachments/${photo.id}/preview`,
          })),
      };
    });
  }
}

/** Where a link stands at `now`: used, withdrawn, run out, or still open. */
export function linkStatus(link: typeof approvalLinks.$inferSelect, now: Date): ApprovalLinkStatus {
  if (link.usedAt) return 'used';
  if (link.revokedAt) return 'revoked';
  return link.expiresAt <= now ? 'expired' : 'active';
}

export function toApprovalLinkDto(link: typeof approvalLinks.$inferSelect, now: Date): ApprovalLinkDto {
  return {
    id: link.id,
    sentAt: link.createdAt.toISOString(),
    expiresAt: link.expiresAt.toISOString(),
    status: linkStatus(link, now),
    sentTo: link.sentTo,
  };
}

function extensionOf(attachment: AttachmentRow): string {
  return attachment.storedName.split('.').at(-1) ?? 'bin';
}
