import { extname } from 'node:path';
import {
  BadRequestException,
  ConflictException,
  GoneException,
  Inject,
  Injectable,
  NotFoundException,
  type StreamableFile,
} from '@nestjs/common';
import { and, asc, eq, inArray, isNull } from 'drizzle-orm';
import {
  FINDING_SEVERITY_FOR_CUSTOMERS,
  findingPrice,
  type ApprovalLinkDto,
  type ApprovalRequested,
  type PublicApproval,
  type PublicApprovalAnswerBody,
  type PublicApprovalResult,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { foundOrFail } from '../common/not-found.js';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import {
  approvalLinkFindings,
  approvalLinks,
  attachments,
  customers,
  findings,
  jobLines,
  repairOrders,
  users,
  vehicles,
} from '../db/schema/index.js';
import { describeVehicle } from '../floor/describe-vehicle.js';
import { FindingsService, linkStatus, toApprovalLinkDto } from '../findings/findings.service.js';
import { titleFromNote } from '../findings/finding-words.js';
import { NoticesService } from '../findings/notices.service.js';
import { PhotoStore } from '../findings/photo-store.js';
import { LiveService } from '../live/live.service.js';
import { ShopService } from '../shop/shop.service.js';
import { hashApprovalToken, newApprovalToken, TOKEN_PATTERN } from './approval-token.js';
import type { ClientInfo } from './client-request.js';

type LinkRow = typeof approvalLinks.$inferSelect;
type QuotedRow = typeof approvalLinkFindings.$inferSelect;

const HOUR_MS = 3_600_000;
const NOT_VALID = 'This approval link is not valid: check it against the message you received';

/**
 * Approval links: the advisor sends one for the reviewed findings of a repair order; the customer
 * opens it without signing in, sees the quoted prices and photos, and answers once.
 */
@Injectable()
export class ApprovalsService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly audit: AuditService,
    private readonly shop: ShopService,
    private readonly findings: FindingsService,
    private readonly notices: NoticesService,
    private readonly photos: PhotoStore,
    private readonly live: LiveService,
  ) {}

  /**
   * A new link for this finding and every other reviewed, unanswered one on its repair order, sent by
   * e-mail and text. Links still open for those findings are withdrawn: only the newest one answers.
   */
  @Transactional()
  request(findingId: number, actor: Principal, origin: string, now = new Date()): ApprovalRequested {
    const { finding, ro, vehicle, customer } = foundOrFail(
      this.db
        .select({ finding: findings, ro: repairOrders, vehicle: vehicles, customer: customers })
        .from(findings)
        .innerJoin(jobLines, eq(jobLines.id, findings.jobLineId))
        .innerJoin(repairOrders, eq(repairOrders.id, jobLines.repairOrderId))
        .innerJoin(vehicles, eq(vehicles.id, repairOrders.vehicleId))
        .innerJoin(customers, eq(customers.id, repairOrders.customerId))
        .where(eq(findings.id, findingId))
        .get(),
      'Finding',
    );
    if (finding.answer !== 'pending') throw new ConflictException('That finding was already answered');
    if (finding.customerWording === null || finding.bookHours === null)
      throw new ConflictException('Review the wording and the price before sending');
    if (ro.status === 'closed') throw new ConflictException('That repair order is closed');
    const settings = this.shop.settings();
    if (settings.labourRateCents <= 0)
      throw new ConflictException('Set the shop’s labour rate first (Admin, Shop)');
    const contact = this.notices.contactOf(customer);

    const quoted = this.db
      .select({ finding: findings })
      .from(findings)
      .innerJoin(jobLines, eq(jobLines.id, findings.jobLineId))
      .where(and(eq(jobLines.repairOrderId, ro.id), eq(findings.answer, 'pending')))
      .orderBy(asc(findings.id))
      .all()
      .map((row) => row.finding)
      .filter((f) => f.customerWording !== null && f.bookHours !== null);
    const ids = quoted.map((f) => f.id);
    this.withdrawOpenLinks(ids, actor, now);

    const { token, hash } = newApprovalToken();
    const sentTo = [contact.email, contact.mobile].filter((to): to is string => !!to);
    const link = this.db
      .insert(approvalLinks)
      .values({
        tokenHash: hash,
        repairOrderId: ro.id,
        sentBy: actor.id,
        sentTo,
        createdAt: now,
        expiresAt: new Date(now.getTime() + settings.approvalLinkHours * HOUR_MS),
      })
      .returning()
      .get();
    const items = quoted.map((f) => {
      const row = {
        linkId: link.id,
        findingId: f.id,
        wording: f.customerWording!,
        severity: f.severity,
        bookHours: f.bookHours!,
        labourRateCents: settings.labourRateCents,
        partsCents: f.partsCents,
      };
      this.db.insert(approvalLinkFindings).values(row).run();
      return row;
    });

    const approvalUrl = `${this.config.publicUrl ?? origin}/approve/${token}`;
    const priced = items.map((item) => ({ wording: item.wording, priceCents: priceOf(item).priceCents }));
    const queued = this.notices.approvalRequest({
      customer: contact,
      vehicle: describeVehicle(vehicle),
      repairOrderNumber: ro.number,
      url: approvalUrl,
      expiresAt: link.expiresAt,
      items: priced,
      totalCents: priced.reduce((sum, item) => sum + item.priceCents, 0),
      // Numbered by item and photo: each finding's photos start at 1, and one name for two photos
      // makes a mail client show or save one in place of the other.
      photos: ids.flatMap((id, item) =>
        this.notices.photosOf(id, 'original').map((photo, n) => ({
          ...photo,
          filename: `finding-${item + 1}-photo-${n + 1}${extname(photo.path)}`,
        })),
      ),
    });
    for (const id of ids)
      this.audit.record(
        {
          actorId: actor.id,
          action: 'request-approval',
          entity: 'finding',
          entityId: id,
          detail: { linkId: link.id, mailId: queued.mail?.mailId, textId: queued.text?.textId, sentTo },
        },
        now,
      );
    this.live.publish('repair-order.updated', { repairOrderId: ro.id });
    return {
      approvalUrl,
      expiresAt: link.expiresAt.toISOString(),
      link: toApprovalLinkDto(link, now),
      findingIds: ids,
      ...queued,
    };
  }

  /** The advisor withdraws a link: it answers 410 from now on. */
  @Transactional()
  revoke(linkId: number, actor: Principal, now = new Date()): ApprovalLinkDto {
    const link = foundOrFail(
      this.db.select().from(approvalLinks).where(eq(approvalLinks.id, linkId)).get(),
      'Approval link',
    );
    if (link.usedAt) throw new ConflictException('The customer already answered through that link');
    if (link.revokedAt) return toApprovalLinkDto(link, now);
    const revoked = this.db
      .update(approvalLinks)
      .set({ revokedAt: now, revokedBy: actor.id })
      .where(eq(approvalLinks.id, linkId))
      .returning()
      .get();
    this.audit.record(
      { actorId: actor.id, action: 'revoke', entity: 'approval-link', entityId: linkId },
      now,
    );
    this.live.publish('repair-order.updated', { repairOrderId: link.repairOrderId });
    return toApprovalLinkDto(revoked, now);
  }

  /** What the customer's page shows. */
  view(token: string, now = new Date()): PublicApproval {
    const link = this.open(token, now);
    const items = this.itemsOf(link.id);
    const { ro, vehicle } = this.db
      .select({ ro: repairOrders, vehicle: vehicles })
      .from(repairOrders)
      .innerJoin(vehicles, eq(vehicles.id, repairOrders.vehicleId))
      .where(eq(repairOrders.id, link.repairOrderId))
      .get()!;
    const photos = this.db
      .select({ id: attachments.id, findingId: attachments.findingId })
      .from(attachments)
      .where(
        inArray(
          attachments.findingId,
          items.map((item) => item.findingId),
        ),
      )
      .orderBy(asc(attachments.id))
      .all();
    const settings = this.shop.settings();
    const shown = items.map((item) => ({
      id: item.findingId,
      wording: item.wording,
      severity: item.severity,
      severityWords: FINDING_SEVERITY_FOR_CUSTOMERS[item.severity],
      bookHours: item.bookHours,
      ...priceOf(item),
      photos: photos
        .filter((photo) => photo.findingId === item.findingId)
        .map((photo) => ({
          url: `/api/public/approvals/${token}/photos/${photo.id}`,
          previewUrl: `/api/public/approvals/${token}/photos/${photo.id}/preview`,
        })),
    }));
    return {
      shop: { name: settings.name, phone: settings.phone, timeZone: settings.timeZone },
      repairOrderNumber: ro.number,
      vehicle: describeVehicle(vehicle),
      labourRateCents: items[0]?.labourRateCents ?? settings.labourRateCents,
      taxNote: settings.taxNote,
      expiresAt: link.expiresAt.toISOString(),
      findings: shown,
      totalCents: shown.reduce((sum, item) => sum + item.priceCents, 0),
    };
  }

  /** A photo of a finding on the link; any other photo answers as if it did not exist. */
  photo(token: string, photoId: number, variant: 'original' | 'preview', now = new Date()): StreamableFile {
    const link = this.open(token, now);
    const photo = this.db
      .select({ attachment: attachments })
      .from(attachments)
      .innerJoin(
        approvalLinkFindings,
        and(
          eq(approvalLinkFindings.findingId, attachments.findingId),
          eq(approvalLinkFindings.linkId, link.id),
        ),
      )
      .where(eq(attachments.id, photoId))
      .get()?.attachment;
    if (!photo) throw new NotFoundException('Photo not found');
    const name = `photo-${photo.id}`;
    return variant === 'preview' && photo.previewName
      ? this.photos.stream(photo.previewName, 'image/jpeg', `${name}-preview.jpg`)
      : this.photos.stream(photo.storedName, photo.mimeType, `${name}.${photo.storedName.split('.').at(-1)}`);
  }

  /**
   * The customer's answer: each finding on the link approved or declined, signed by name, once. The
   * answer keeps its time, address and browser; approved findings become queued lines.
   */
  @Transactional()
  answer(
    token: string,
    body: PublicApprovalAnswerBody,
    client: ClientInfo,
    now = new Date(),
  ): PublicApprovalResult {
    const link = this.open(token, now);
    const items = this.itemsOf(link.id);
    const onLink = new Map(items.map((item) => [item.findingId, item]));
    // A finding not on this link answers like a wrong link: nothing says whether it exists.
    if (body.answers.some((answer) => !onLink.has(answer.findingId))) throw new NotFoundException(NOT_VALID);
    if (body.answers.length !== items.length)
      throw new BadRequestException('Approve or decline each item on the page');

    this.db
      .update(approvalLinks)
      .set({
        usedAt: now,
        signedName: body.signedName,
        answeredIp: client.ip,
        answeredUserAgent: client.userAgent,
      })
      .where(eq(approvalLinks.id, link.id))
      .run();
    const sender = this.db.select().from(users).where(eq(users.id, link.sentBy)).get()!;
    const source = {
      channel: 'link' as const,
      linkId: link.id,
      signedName: body.signedName,
      actor: { id: sender.id, name: sender.name, role: sender.role },
    };
    for (const { findingId, answer } of body.answers) {
      const item = onLink.get(findingId)!;
      this.findings.recordAnswer(
        findingId,
        answer === 'approved'
          ? { answer, bookHours: item.bookHours, title: titleFromNote(item.wording) }
          : { answer, note: 'Declined by the customer on the approval page' },
        source,
        now,
      );
    }
    this.audit.record(
      {
        actorId: null,
        action: 'customer-answer',
        entity: 'approval-link',
        entityId: link.id,
        detail: {
          answers: body.answers,
          signedName: body.signedName,
          ip: client.ip,
          userAgent: client.userAgent,
        },
      },
      now,
    );
    return {
      answeredAt: now.toISOString(),
      signedName: body.signedName,
      approvedCents: body.answers
        .filter((answer) => answer.answer === 'approved')
        .reduce((sum, answer) => sum + priceOf(onLink.get(answer.findingId)!).priceCents, 0),
      answers: body.answers,
    };
  }

  /**
   * The link behind a token when it can still be answered: 404 when there is none (or the token is
   * not even shaped like one), 410 once it was used, withdrawn, run out, or answered by the shop.
   */
  private open(token: string, now: Date): LinkRow {
    const link = TOKEN_PATTERN.test(token)
      ? this.db
          .select()
          .from(approvalLinks)
          .where(eq(approvalLinks.tokenHash, hashApprovalToken(token)))
          .get()
      : undefined;
    if (!link) throw new NotFoundException(NOT_VALID);
    const status = linkStatus(link, now);
    if (status === 'used') throw new GoneException('This request was already answered: thank you');
    if (status === 'revoked' && this.closed(link.repairOrderId))
      throw new GoneException('This visit is over and the vehicle picked up: call the shop about this work');
    if (status === 'revoked') throw new GoneException('The shop withdrew this link: call them for a new one');
    if (status === 'expired') throw new GoneException('This link has expired: call the shop for a new one');
    const waiting = this.db
      .select({ id: findings.id })
      .from(approvalLinkFindings)
      .innerJoin(findings, eq(findings.id, approvalLinkFindings.findingId))
      .where(and(eq(approvalLinkFindings.linkId, link.id), eq(findings.answer, 'pending')))
      .all();
    if (waiting.length < this.itemsOf(link.id).length)
      throw new GoneException('The shop already recorded your answer: call them with any change');
    return link;
  }

  private closed(repairOrderId: number): boolean {
    const ro = this.db
      .select({ status: repairOrders.status })
      .from(repairOrders)
      .where(eq(repairOrders.id, repairOrderId))
      .get();
    return ro?.status === 'closed';
  }

  private itemsOf(linkId: number): QuotedRow[] {
    return this.db
      .select()
      .from(approvalLinkFindings)
      .where(eq(approvalLinkFindings.linkId, linkId))
      .orderBy(asc(approvalLinkFindings.findingId))
      .all();
  }

  private withdrawOpenLinks(findingIds: number[], actor: Principal, now: Date): void {
    if (!findingIds.length) return;
    const open = this.db
      .selectDistinct({ link: approvalLinks })
      .from(approvalLinks)
      .innerJoin(approvalLinkFindings, eq(approvalLinkFindings.linkId, approvalLinks.id))
      .where(
        and(
          inArray(approvalLinkFindings.findingId, findingIds),
          isNull(approvalLinks.usedAt),
          isNull(approvalLinks.revokedAt),
        ),
      )
      .all()
      .filter(({ link }) => linkStatus(link, now) === 'active');
    for (const { link } of open) {
      this.db
        .update(approvalLinks)
        .set({ revokedAt: now, revokedBy: actor.id })
        .where(eq(approvalLinks.id, link.id))
        .run();
      this.audit.record(
        { actorId: actor.id, action: 'replace', entity: 'approval-link', entityId: link.id },
        now,
      );
    }
  }
}

function priceOf(item: Pick<QuotedRow, 'bookHours' | 'labourRateCents' | 'partsCents'>) {
  return findingPrice(item.bookHours, item.labourRateCents, item.partsCents);
}
