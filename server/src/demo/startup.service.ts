import { Inject, Injectable, Logger } from '@nestjs/common';
import { eq } from 'drizzle-orm';
import { hashSecret, verifySecret } from '../auth/passwords.js';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';
import { DB, type Db } from '../db/database.js';
import { users } from '../db/schema/index.js';
import { ScreensService } from '../screens/screens.service.js';
import { ShopService } from '../shop/shop.service.js';
import { UsersService } from '../users/users.service.js';
import { DemoShopSeeder } from './demo-shop.js';

/** First-run work: the shop row, the bootstrap owner from the environment, and the demo shop. */
@Injectable()
export class StartupService {
  private readonly logger = new Logger('Startup');

  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @Inject(DB) private readonly db: Db,
    private readonly shop: ShopService,
    private readonly users: UsersService,
    private readonly screens: ScreensService,
    private readonly demo: DemoShopSeeder,
  ) {}

  async prepare(): Promise<void> {
    if (this.config.demo && this.demo.isEmpty()) {
      await this.demo.seed();
      this.logger.log('Seeded the demo shop');
    }
    this.shop.ensure();
    await this.ensureAdmin();
    if (this.config.demo) this.offerWallPairing();
  }

  private offerWallPairing(): void {
    const pairing = this.screens.firstScreenCode('Shop floor TV');
    if (pairing === 'pending')
      this.logger.log(
        'A wall screen pairing code is still waiting: lost it? Make a new one in Admin › Wall screens',
      );
    else if (pairing !== 'paired')
      this.logger.log(
        `Wall screen pairing code (30 min): ${pairing.code}, or open /wall?code=${pairing.code}`,
      );
  }

  private async ensureAdmin(): Promise<void> {
    const { adminEmail: email, adminPassword: password } = this.config;
    if (!email || !password) return;
    const existing = this.db.select().from(users).where(eq(users.email, email.toLowerCase())).get();
    if (!existing) {
      await this.users.create({ name: 'Owner', role: 'owner', email, password }, null);
      this.logger.log(`Created the owner account ${email}`);
    } else if (
      existing.role !== 'owner' ||
      !existing.active ||
      !(await verifySecret(password, existing.passwordHash))
    ) {
      this.db
        .update(users)
        .set({ role: 'owner', active: true, passwordHash: await hashSecret(password) })
        .where(eq(users.id, existing.id))
        .run();
      this.logger.log(`Reset the owner account ${email} from the environment`);
    }
  }
}
