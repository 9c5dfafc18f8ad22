import { BadRequestException, ConflictException, Inject, Injectable } from '@nestjs/common';
import { and, asc, eq } from 'drizzle-orm';
import {
  FINDING_SEVERITY_LABELS,
  lineWords,
  formatCents,
  formatPhone,
  formatShopInstant,
  isOpenLine,
  normalisePhone,
  repairOrderStatus,
  type MailQueued,
  type NoticesQueued,
  type TextQueued,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { describeVehicle } from '../floor/describe-vehicle.js';
import { foundOrFail } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import {
  attachments,
  customers,
  findings,
  jobLines,
  repairOrders,
  users,
  vehicles,
} from '../db/schema/index.js';
import { LiveService } from '../live/live.service.js';
import { OutboxService, type OutgoingMail } from '../mail/outbox.service.js';
import { ShopService } from '../shop/shop.service.js';
import { PhotoStore } from './photo-store.js';

const hours = (value: number) => `${Number(value.toFixed(2))} hour${value === 1 ? '' : 's'}`;

/** A customer's ways to be reached: an e-mail address and a number that takes texts. */
export interface CustomerContact {
  name: string;
  email: string | null;
  mobile: string | null;
}

/** The approval request's contents: the page link and what it asks about. */
export interface ApprovalRequestNotice {
  customer: CustomerContact;
  vehicle: string;
  repairOrderNumber: string;
  url: string;
  expiresAt: Date;
  items: { wording: string; priceCents: number }[];
  totalCents: number;
  photos: { filename: string; path: string }[];
}

/**
 * The messages about findings and repair orders, in plain words with the shop's name, by e-mail and
 * by text: no images in the body, nothing that tracks the reader; the only link is the approval
 * page's. They go through the outbox.
 */
@Injectable()
export class NoticesService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly outbox: OutboxService,
    private readonly shop: ShopService,
    private readonly audit: AuditService,
    private readonly photos: PhotoStore,
    private readonly live: LiveService,
  ) {}

  /** The customer's contacts; 400 when there is no way to reach them. */
  contactOf(customer: typeof customers.$inferSelect): CustomerContact {
    const email = customer.email?.trim() || null;
    const mobile = customer.phone ? normalisePhone(customer.phone) : null;
    if (!email && !mobile)
      throw new BadRequestException('The customer has no e-mail address or phone number for texts');
    return { name: customer.name, email, mobile };
  }

  /** Asks the customer to approve or decline the findings on the page the link opens. */
  approvalRequest(notice: ApprovalRequestNotice): NoticesQueued {
    const settings = this.shop.settings();
    const shop = settings.name;
    const until = formatShopInstant(notice.expiresAt, settings.timeZone, settings.clockFormat);
    const callUs = settings.phone ? ` Questions? Call us at ${formatPhone(settings.phone)}.` : '';
    const many = notice.items.length > 1;
    const mail =
      notice.customer.email &&
      this.queueMail({
        to: notice.customer.email,
        subject: `${shop}: approval needed for RO ${notice.repairOrderNumber}`,
        text: [
          `Hello ${notice.customer.name},`,
          '',
          `While working on your ${notice.vehicle} (repair order ${notice.repairOrderNumber}), our ` +
            `technician found ${many ? 'some things' : 'something'} we would like your decision on ` +
            'before we go further.',
          '',
          ...notice.items.map((item) => `- ${item.wording} (estimate ${formatCents(item.priceCents)})`),
          '',
          `Estimated total: ${formatCents(notice.totalCents)}.${settings.taxNote ? ` ${settings.taxNote}` : ''}`,
          ...(notice.photos.length
            ? [`Photos: ${notice.photos.length} attached, as our technician took them.`]
            : []),
          '',
          `See the photos, approve or decline ${many ? 'each item' : 'it'}, and sign on this page:`,
          notice.url,
          '',
          `The link works until ${until}. We will not do this extra work without your approval.${callUs}`,
          '',
          'Thank you,',
          shop,
        ].join('\n'),
        attachments: notice.photos,
        secretBody: true,
      });
    const text =
      notice.customer.mobile &&
      this.queueText(
        notice.customer.mobile,
        `${shop}: we found ${many ? `${notice.items.length} items` : 'something'} on your ` +
          `${notice.vehicle} (RO ${notice.repairOrderNumber}) that need your OK first. Estimate ` +
          `${formatCents(notice.totalCents)}. See photos and answer: ${notice.url} (until ${until})`,
        true,
      );
    return { mail: mail || null, text: text || null };
  }

  /**
   * Tells the customer the vehicle is ready, once the work on the repair order is done (every line
   * done or cancelled) and the vehicle is still here. Written into the RO's history.
   */
  @Transactional()
  readyNotice(repairOrderId: number, actor: Principal): NoticesQueued {
    const { ro, vehicle, customer } = foundOrFail(
      this.db
        .select({ ro: repairOrders, vehicle: vehicles, customer: customers })
        .from(repairOrders)
        .innerJoin(vehicles, eq(vehicles.id, repairOrders.vehicleId))
        .innerJoin(customers, eq(customers.id, repairOrders.customerId))
        .where(eq(repairOrders.id, repairOrderId))
        .get(),
      'Repair order',
    );
    const lines = this.db
      .select()
      .from(jobLines)
      .where(eq(jobLines.repairOrderId, repairOrderId))
      .orderBy(asc(jobLines.lineNo))
      .all();
    if (ro.status === 'closed')
      throw new ConflictException(`RO ${ro.number} is closed: the vehicle was picked up`);
    const open = lines.filter(isOpenLine);
    if (repairOrderStatus(lines, ro.closedAt) !== 'done')
      throw new ConflictException(
        `The work on RO ${ro.number} is not done yet (${open.length} of ${lines.length} lines open)`,
      );
    const contact = this.contactOf(customer);
    const shop = this.shop.settings().name;
    const declined = this.db
      .select({ wording: findings.customerWording, lineTitle: jobLines.title })
      .from(findings)
      .innerJoin(jobLines, eq(jobLines.id, findings.jobLineId))
      .where(and(eq(jobLines.repairOrderId, repairOrderId), eq(findings.answer, 'declined')))
      .orderBy(asc(findings.id))
      .all();
    const text = [
      `Hello ${customer.name},`,
      '',
      `Your ${describeVehicle(vehicle)} is ready to collect (repair order ${ro.number}).`,
      '',
      'Work done:',
      ...lines.filter((line) => line.status === 'done').map((line) => `- ${line.title}`),
      ...(declined.length
        ? ['', 'We also found, and did not do as you asked (worth another look later):']
        : []),
      // The technician's own note stays in the shop: only wording the advisor reviewed goes out.
      ...declined.map(
        (finding) =>
          `- ${finding.wording ?? `Something our technician noted during "${finding.lineTitle}": ask us for the details`}`,
      ),
      '',
      'Thank you,',
      shop,
    ].join('\n');
    const mail =
      contact.email &&
      this.queueMail({
        to: contact.email,
        subject: `${shop}: your ${describeVehicle(vehicle)} is ready (RO ${ro.number})`,
        text,
      });
    const texted =
      contact.mobile &&
      this.queueText(
        contact.mobile,
        `${shop}: your ${describeVehicle(vehicle)} is ready to collect (RO ${ro.number}). Thank you!`,
      );
    const queued = { mail: mail || null, text: texted || null };
    this.audit.record({
      actorId: actor.id,
      action: 'ready-notice',
      entity: 'repair-order',
      entityId: repairOrderId,
      detail: {
        mailId: queued.mail?.mailId,
        textId: queued.text?.textId,
        to: contact.email,
        mobile: contact.mobile,
      },
    });
    this.live.publish('repair-order.updated', { repairOrderId });
    return queued;
  }

  /** Lets the RO's advisor know a finding waits for them; nothing when the advisor has no e-mail. */
  findingCreated(findingId: number): MailQueued | null {
    const { finding, line, ro, vehicle, technicianName } = this.findingContext(findingId);
    const advisor = ro.advisorId
      ? this.db.select().from(users).where(eq(users.id, ro.advisorId)).get()
      : undefined;
    const to = advisor?.active ? advisor.email?.trim() : null;
    if (!to) return null;
    const shop = this.shop.settings().name;
    const previews = this.photosOf(findingId, 'preview');
    const text = [
      `Hello ${advisor!.name},`,
      '',
      `${technicianName} found something on RO ${ro.number}, ${describeVehicle(vehicle)}, ` +
        `${lineWords(line.lineNo)} "${line.title}".`,
      '',
      `What was found: ${finding.note}`,
      `How urgent: ${FINDING_SEVERITY_LABELS[finding.severity]}.`,
      ...(finding.suggestedHours !== null ? [`Suggested hours: ${hours(finding.suggestedHours)}.`] : []),
      `Photos: ${previews.length ? `${previews.length} attached (small copies)` : 'none'}.`,
      ...(line.status === 'held' && line.holdReason === 'approval'
        ? ['', 'The line is held until the finding is answered.']
        : []),
      '',
      'Answer it in the findings inbox in Baytime.',
      '',
      shop,
    ].join('\n');
    return this.queueMail({
      to,
      subject: `${shop}: new finding on RO ${ro.number} (${FINDING_SEVERITY_LABELS[finding.severity]})`,
      text,
      attachments: previews,
    });
  }

  private queueMail(mail: OutgoingMail): MailQueued {
    const row = this.outbox.queueMail(mail);
    return {
      mailId: row.id,
      to: row.recipient,
      subject: mail.subject,
      attachments: (mail.attachments ?? []).map((attachment) => attachment.filename),
    };
  }

  private queueText(to: string, body: string, secretBody = false): TextQueued {
    return { textId: this.outbox.queueText({ to, body, secretBody }).id, to };
  }

  photosOf(findingId: number, variant: 'original' | 'preview'): { filename: string; path: string }[] {
    return this.db
      .select()
      .from(attachments)
      .where(eq(attachments.findingId, findingId))
      .orderBy(asc(attachments.id))
      .all()
      .map((photo, i) => {
        const name = variant === 'preview' && photo.previewName ? photo.previewName : photo.storedName;
        return { filename: `photo-${i + 1}.${name.split('.').at(-1)}`, path: this.photos.path(name) };
      });
  }

  private findingContext(findingId: number) {
    return foundOrFail(
      this.db
        .select({
          finding: findings,
          line: jobLines,
          ro: repairOrders,
          vehicle: vehicles,
          customer: customers,
          technicianName: users.name,
        })
        .from(findings)
        .innerJoin(jobLines, eq(jobLines.id, findings.jobLineId))
        .innerJoin(repairOrders, eq(repairOrders.id, jobLines.repairOrderId))
        .innerJoin(vehicles, eq(vehicles.id, repairOrders.vehicleId))
        .innerJoin(customers, eq(customers.id, repairOrders.customerId))
        .innerJoin(users, eq(users.id, findings.technicianId))
        .where(eq(findings.id, findingId))
        .get(),
      'Finding',
    );
  }
}
