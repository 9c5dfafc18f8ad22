import { BadRequestException, ConflictException, Inject, Injectable } from '@nestjs/common';
import { and, asc, eq } from 'drizzle-orm';
import { FINDING_SEVERITY_WORDS, isOpenLine, repairOrderStatus, type MailQueued } from '@baytime/shared';
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
import { MailService, type OutgoingMail } from '../mail/mail.service.js';
import { ShopService } from '../shop/shop.service.js';
import { PhotoStore } from './photo-store.js';

const hours = (value: number) => `${Number(value.toFixed(2))} hour${value === 1 ? '' : 's'}`;

/**
 * The e-mails about findings and repair orders, in plain words with the shop's name: no links, no
 * images in the body, nothing that tracks the reader. They go through the outbox.
 */
@Injectable()
export class NoticesService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly mail: MailService,
    private readonly shop: ShopService,
    private readonly audit: AuditService,
    private readonly photos: PhotoStore,
    private readonly live: LiveService,
  ) {}

  /** Asks the customer to approve the extra work, with the finding's photos attached. */
  @Transactional()
  requestApproval(findingId: number, actor: Principal): MailQueued {
    const { finding, line, ro, vehicle, customer } = this.findingContext(findingId);
    if (finding.answer !== 'pending') throw new ConflictException('That finding was already answered');
    const to = this.customerEmail(customer);
    const shop = this.shop.settings().name;
    const photos = this.photosOf(findingId, 'original');
    const text = [
      `Hello ${customer.name},`,
      '',
      `While working on your ${describeVehicle(vehicle)} (repair order ${ro.number}, "${line.title}"), ` +
        'our technician found something we would like your decision on before we go further.',
      '',
      `What we found: ${finding.note}`,
      `How urgent: ${FINDING_SEVERITY_WORDS[finding.severity]}.`,
      ...(finding.suggestedHours !== null
        ? [`Suggested extra labour: ${hours(finding.suggestedHours)}.`]
        : []),
      ...(photos.length
        ? [`Photos: ${photos.length} attached, as our technician took them.`]
        : ['We took no photos of this one.']),
      '',
      'We will not do this extra work without your approval. Please reply to this e-mail or call us ' +
        'to say yes or no, or if you have any questions.',
      '',
      'Thank you,',
      shop,
    ].join('\n');
    const queued = this.send({
      to,
      subject: `${shop}: approval needed for RO ${ro.number}`,
      text,
      attachments: photos,
    });
    this.audit.record({
      actorId: actor.id,
      action: 'request-approval',
      entity: 'finding',
      entityId: findingId,
      detail: { mailId: queued.mailId, to },
    });
    return queued;
  }

  /**
   * Tells the customer the vehicle is ready, once the work on the repair order is done (every line
   * done or cancelled) and the vehicle is still here. Written into the RO's history.
   */
  @Transactional()
  readyNotice(repairOrderId: number, actor: Principal): MailQueued {
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
    const to = this.customerEmail(customer);
    const shop = this.shop.settings().name;
    const declined = this.db
      .select({ note: findings.note })
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
      ...declined.map((finding) => `- ${finding.note}`),
      '',
      'Thank you,',
      shop,
    ].join('\n');
    const queued = this.send({
      to,
      subject: `${shop}: your ${describeVehicle(vehicle)} is ready (RO ${ro.number})`,
      text,
    });
    this.audit.record({
      actorId: actor.id,
      action: 'ready-notice',
      entity: 'repair-order',
      entityId: repairOrderId,
      detail: { mailId: queued.mailId, to },
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
        `line ${line.lineNo} "${line.title}".`,
      '',
      `What was found: ${finding.note}`,
      `How urgent: ${FINDING_SEVERITY_WORDS[finding.severity]}.`,
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
    return this.send({
      to,
      subject: `${shop}: new finding on RO ${ro.number} (${finding.severity})`,
      text,
      attachments: previews,
    });
  }

  private send(mail: OutgoingMail): MailQueued {
    const row = this.mail.queue(mail);
    return {
      mailId: row.id,
      to: row.recipient,
      subject: row.subject,
      attachments: (mail.attachments ?? []).map((attachment) => attachment.filename),
    };
  }

  private customerEmail(customer: typeof customers.$inferSelect): string {
    const email = customer.email?.trim();
    if (!email) throw new BadRequestException('The customer has no e-mail address');
    return email;
  }

  private photosOf(findingId: number, variant: 'original' | 'preview'): { filename: string; path: string }[] {
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
