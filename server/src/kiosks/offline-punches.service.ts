import {
  BadRequestException,
  ConflictException,
  HttpException,
  Inject,
  Injectable,
  type OnModuleDestroy,
  type OnModuleInit,
} from '@nestjs/common';
import type { Subscription } from 'rxjs';
import { and, asc, count, desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import {
  MAX_PUNCH_CLOCK_SKEW_SECONDS,
  readIdentityText,
  type OfflinePunchBody,
  type OfflinePunchDto,
  type OfflinePunchListQuery,
  type Page,
} from '@baytime/shared';
import { AuthService } from '../auth/auth.service.js';
import { verifySecret } from '../auth/passwords.js';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { foundOrFail } from '../common/not-found.js';
import { decodeCursor, toPage } from '../common/paging.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { offlinePunches, screens, users } from '../db/schema/index.js';
import { PunchesService } from '../punches/punches.service.js';
import { OfflineKeyService } from './offline-key.service.js';

type Row = typeof offlinePunches.$inferSelect;
type Verdict = Pick<Row, 'badge' | 'technicianId' | 'status' | 'problem'>;

const HOUR_MS = 3600_000;
/** How long a tablet may have been cut off and still send what it recorded. */
const OFFLINE_WINDOW_MS = 7 * 24 * HOUR_MS;
/**
 * Confirming makes a punch of it, checked against the technician's recent punches (the floor keeps
 * 72 hours of them); older ones the foreman adds on the timecard.
 */
const CONFIRM_MAX_AGE_SECONDS = 48 * 3600;

/**
 * Shift and break punches recorded at a kiosk without the server. They wait here, counted nowhere,
 * until the technician signs in online again or the foreman confirms them; a wrong PIN waits as
 * refused and never becomes a punch by itself. A kiosk is told only that the punch arrived, never
 * whether the PIN was right: uploads are no way to guess PINs.
 */
@Injectable()
export class OfflinePunchesService implements OnModuleInit, OnModuleDestroy {
  private subscription: Subscription | null = null;

  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly key: OfflineKeyService,
    private readonly punches: PunchesService,
    private readonly audit: AuditService,
    private readonly auth: AuthService,
  ) {}

  onModuleInit(): void {
    this.subscription = this.auth.badgeSignIns$.subscribe((technician) => this.confirmAtSignIn(technician));
  }

  onModuleDestroy(): void {
    this.subscription?.unsubscribe();
  }

  /** Takes in one punch from a kiosk; the same id again answers the same and changes nothing. */
  async receive(body: OfflinePunchBody, kiosk: Principal, now = new Date()): Promise<{ id: string }> {
    const at = new Date(body.at);
    if (at.getTime() > now.getTime() + MAX_PUNCH_CLOCK_SKEW_SECONDS * 1000)
      throw new BadRequestException('A punch cannot be in the future: check the tablet clock');
    if (at.getTime() < now.getTime() - OFFLINE_WINDOW_MS)
      throw new BadRequestException('That punch is more than a week old: ask the foreman to add it');
    if (this.find(body.id)) return { id: body.id };
    const verdict = await this.check(body);
    return this.uow.run(() => {
      // Another copy may have arrived while the PIN was being checked.
      if (this.find(body.id)) return { id: body.id };
      this.db
        .insert(offlinePunches)
        .values({
          id: body.id,
          kioskId: kiosk.id,
          ...verdict,
          kind: body.kind,
          // A break of no stated kind counts as paid rest, never as an unpaid meal (29 CFR 785.18).
          breakKind: body.kind === 'break-start' ? (body.breakKind ?? null) : null,
          at,
          receivedAt: now,
        })
        .run();
      this.audit.record(
        {
          actorId: null,
          action: 'offline-punch',
          entity: 'kiosk',
          entityId: kiosk.id,
          detail: { punchId: body.id, status: verdict.status, technicianId: verdict.technicianId },
        },
        now,
      );
      return { id: body.id };
    });
  }

  list(query: OfflinePunchListQuery): Page<OfflinePunchDto> {
    const where = query.status ? eq(offlinePunches.status, query.status) : undefined;
    const keyset = decodeCursor(query.cursor);
    const after: SQL | undefined = keyset
      ? sql`(${offlinePunches.at}, ${offlinePunches}.rowid) < (${keyset.at}, ${keyset.id})`
      : undefined;
    const rows = this.db
      .select({ row: offlinePunches, rowid: sql<number>`${offlinePunches}.rowid` })
      .from(offlinePunches)
      .where(and(where, after))
      .orderBy(desc(offlinePunches.at), sql`${offlinePunches}.rowid desc`)
      .limit(query.limit + 1)
      .all();
    const total = this.db.select({ n: count() }).from(offlinePunches).where(where).get()?.n ?? 0;
    return toPage(
      rows,
      query.limit,
      total,
      ({ row, rowid }) => ({ at: row.at.getTime(), id: rowid }),
      (shown) => this.toDtos(shown.map(({ row }) => row)),
    );
  }

  /** The foreman vouches for a punch (a refused one too: the technician mistyped the PIN). */
  @Transactional()
  confirm(id: string, foreman: Principal, now = new Date()): OfflinePunchDto {
    const row = this.undecided(id);
    if (row.technicianId === null) throw new ConflictException('No technician has that badge: reject it');
    const problem = this.makePunch(row, foreman, now);
    if (problem) throw new ConflictException(problem);
    this.audit.record({ actorId: foreman.id, action: 'confirm', entity: 'offline-punch', entityId: id }, now);
    return this.toDtos([this.find(id)!])[0]!;
  }

  @Transactional()
  reject(id: string, foreman: Principal, now = new Date()): OfflinePunchDto {
    this.undecided(id);
    this.db
      .update(offlinePunches)
      .set({ status: 'rejected', decidedAt: now, decidedBy: foreman.id })
      .where(eq(offlinePunches.id, id))
      .run();
    this.audit.record({ actorId: foreman.id, action: 'reject', entity: 'offline-punch', entityId: id }, now);
    return this.toDtos([this.find(id)!])[0]!;
  }

  /**
   * At a sign-in online, the technician's unverified punches become punches, in tapped order. When a
   * wrong PIN was also tried on their badge, none is confirmed this way: the foreman looks first.
   */
  confirmAtSignIn(technician: Principal, now = new Date()): void {
    const waiting = this.db
      .select()
      .from(offlinePunches)
      .where(
        and(
          eq(offlinePunches.technicianId, technician.id),
          inArray(offlinePunches.status, ['unverified', 'refused']),
        ),
      )
      .orderBy(asc(offlinePunches.at))
      .all();
    if (waiting.length === 0 || waiting.some((row) => row.status === 'refused')) return;
    for (const row of waiting)
      this.uow.run(() => {
        if (!this.makePunch(row, technician, now))
          this.audit.record(
            { actorId: technician.id, action: 'confirm', entity: 'offline-punch', entityId: row.id },
            now,
          );
      });
  }

  /**
   * Records the punch with its tapped time and marks it confirmed; or says why it does not fit. One that
   * would change counted time is held for the foreman's review like any late kiosk punch, and says so.
   */
  private makePunch(row: Row, actor: Principal, now: Date): string | null {
    let note: string | null;
    try {
      const recorded = this.punches.record(
        {
          id: row.id,
          kind: row.kind,
          at: row.at.toISOString(),
          ...(row.breakKind && { breakKind: row.breakKind }),
          ...(actor.role !== 'technician' && { technicianId: row.technicianId! }),
        },
        actor,
        now,
        CONFIRM_MAX_AGE_SECONDS,
      );
      note = recorded.held ? `Held for review: ${recorded.punch.heldBecause}` : null;
    } catch (error) {
      if (!(error instanceof HttpException)) throw error;
      this.db
        .update(offlinePunches)
        .set({ problem: error.message })
        .where(eq(offlinePunches.id, row.id))
        .run();
      return error.message;
    }
    this.db
      .update(offlinePunches)
      .set({ status: 'confirmed', problem: note, decidedAt: now, decidedBy: actor.id })
      .where(eq(offlinePunches.id, row.id))
      .run();
    return null;
  }

  /** Opens the sealed badge and PIN and checks them; the answer only goes into the record. */
  private async check(body: OfflinePunchBody): Promise<Verdict> {
    const text = this.key.open(body.keyId, body.identity);
    const identity = text === null ? null : readIdentityText(text);
    const bound =
      identity !== null &&
      identity.id === body.id &&
      identity.kind === body.kind &&
      Date.parse(identity.at) === Date.parse(body.at);
    if (!identity || !bound)
      return {
        badge: null,
        technicianId: null,
        status: 'refused',
        problem: 'The badge and PIN could not be read',
      };
    const person = this.db.select().from(users).where(eq(users.badge, identity.badge)).get();
    const technician = person?.role === 'technician' && person.active ? person : undefined;
    const pinOk = await verifySecret(identity.pin, technician?.pinHash ?? null);
    if (!technician)
      return {
        badge: identity.badge,
        technicianId: null,
        status: 'refused',
        problem: 'No technician has that badge',
      };
    if (!pinOk)
      return { badge: identity.badge, technicianId: technician.id, status: 'refused', problem: 'Wrong PIN' };
    return { badge: identity.badge, technicianId: technician.id, status: 'unverified', problem: null };
  }

  private undecided(id: string): Row {
    const row = foundOrFail(this.find(id), 'Offline punch');
    if (row.status === 'confirmed' || row.status === 'rejected')
      throw new ConflictException(`That punch is already ${row.status}`);
    return row;
  }

  private find(id: string): Row | undefined {
    return this.db.select().from(offlinePunches).where(eq(offlinePunches.id, id)).get();
  }

  private toDtos(rows: Row[]): OfflinePunchDto[] {
    const kioskIds = [...new Set(rows.map((row) => row.kioskId))];
    const techIds = [...new Set(rows.flatMap((row) => (row.technicianId ? [row.technicianId] : [])))];
    const kiosks = new Map(
      kioskIds.length
        ? this.db
            .select({ id: screens.id, name: screens.name })
            .from(screens)
            .where(inArray(screens.id, kioskIds))
            .all()
            .map((k) => [k.id, k.name])
        : [],
    );
    const names = new Map(
      techIds.length
        ? this.db
            .select({ id: users.id, name: users.name })
            .from(users)
            .where(inArray(users.id, techIds))
            .all()
            .map((u) => [u.id, u.name])
        : [],
    );
    return rows.map((row) => ({
      id: row.id,
      kioskName: kiosks.get(row.kioskId) ?? '?',
      badge: row.badge,
      technicianId: row.technicianId,
      technicianName: row.technicianId ? (names.get(row.technicianId) ?? null) : null,
      kind: row.kind,
      breakKind: row.breakKind,
      at: row.at.toISOString(),
      status: row.status,
      problem: row.problem,
      receivedAt: row.receivedAt.toISOString(),
      decidedAt: row.decidedAt?.toISOString() ?? null,
    }));
  }
}
