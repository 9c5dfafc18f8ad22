import { Inject, Injectable } from '@nestjs/common';
import { eq } from 'drizzle-orm';
import type { ShopSettings, UpdateShopBody } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { Subject } from 'rxjs';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { shopSettings } from '../db/schema/index.js';
import { LiveService } from '../live/live.service.js';

const WEEKDAY_HOURS = { open: '07:30', close: '17:30' };

/** A new shop's settings until the owner changes them. */
export const DEFAULT_SHOP: ShopSettings = {
  name: 'My shop',
  timeZone: 'America/Chicago',
  workweekStartDay: 0,
  workweekStartHour: 0,
  units: 'us',
  maxConcurrentJobs: 1,
  concurrentSplit: 'even',
  minimumWageCents: 725,
  overtimeRules: 'federal',
  openingHours: [null, WEEKDAY_HOURS, WEEKDAY_HOURS, WEEKDAY_HOURS, WEEKDAY_HOURS, WEEKDAY_HOURS, null],
  kioskIdleSeconds: 60,
  payNonProductiveSeparately: true,
  techniciansTakeUnassigned: true,
  phone: null,
  labourRateCents: 0,
  taxNote: '',
  approvalLinkHours: 72,
};

@Injectable()
export class ShopService {
  /** Read on every request and every board refresh; only this service writes the row. */
  private cached: ShopSettings | null = null;
  /** The settings as saved, once the change has committed. */
  readonly changed$ = new Subject<ShopSettings>();

  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly live: LiveService,
  ) {}

  settings(): ShopSettings {
    if (this.cached) return this.cached;
    const row = this.db.select().from(shopSettings).where(eq(shopSettings.id, 1)).get();
    if (!row) return DEFAULT_SHOP;
    const { id: _id, updatedAt: _updatedAt, ...settings } = row;
    this.cached = settings;
    return settings;
  }

  /** Creates the settings row on first start; keeps an existing one as it is. */
  ensure(initial: Partial<ShopSettings> = {}): void {
    this.cached = null;
    this.db
      .insert(shopSettings)
      .values({ ...DEFAULT_SHOP, ...initial, id: 1, updatedAt: new Date() })
      .onConflictDoNothing()
      .run();
  }

  @Transactional()
  update(body: UpdateShopBody, actor: Principal): ShopSettings {
    this.ensure();
    if (Object.keys(body).length === 0) return this.settings();
    this.db
      .update(shopSettings)
      .set({ ...body, updatedAt: new Date() })
      .where(eq(shopSettings.id, 1))
      .run();
    this.cached = null;
    this.audit.record({ actorId: actor.id, action: 'update', entity: 'shop', entityId: 1, detail: body });
    this.uow.afterCommit(() => this.changed$.next(this.settings()));
    // Every kiosk takes the split rule and idle sign-out from the settings.
    this.live.publish('shop.updated', { shop: this.settings() }, { to: 'everyone' });
    return this.settings();
  }
}
