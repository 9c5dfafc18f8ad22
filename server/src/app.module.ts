import { Module, type DynamicModule } from '@nestjs/common';
import { ScheduleModule } from '@nestjs/schedule';
import { ServeStaticModule } from '@nestjs/serve-static';
import { join } from 'node:path';
import { AuditModule } from './audit/audit.module.js';
import { AuthModule } from './auth/auth.module.js';
import { BackupModule } from './backup/backup.module.js';
import { BaysModule } from './bays/bays.module.js';
import { BoardModule } from './board/board.module.js';
import { APP_CONFIG, type AppConfig } from './config/app-config.js';
import { DatabaseModule } from './db/database.module.js';
import { DemoModule } from './demo/demo.module.js';
import { DispatchModule } from './dispatch/dispatch.module.js';
import { FindingsModule } from './findings/findings.module.js';
import { ApprovalsModule } from './approvals/approvals.module.js';
import { HealthModule } from './health/health.module.js';
import { LabourModule } from './labour/labour.module.js';
import { LiveModule } from './live/live.module.js';
import { PayWeeksModule } from './pay-weeks/pay-weeks.module.js';
import { PayrollModule } from './payroll/payroll.module.js';
import { PayrollExportModule } from './payroll-export/payroll-export.module.js';
import { PunchesModule } from './punches/punches.module.js';
import { RepairOrderImportModule } from './repair-order-import/repair-order-import.module.js';
import { ReportsModule } from './reports/reports.module.js';
import { KiosksModule } from './kiosks/kiosks.module.js';
import { ScreensModule } from './screens/screens.module.js';
import { ShopModule } from './shop/shop.module.js';
import { TimecardsModule } from './timecards/timecards.module.js';
import { TimersModule } from './timers/timers.module.js';
import { UsersModule } from './users/users.module.js';
import { VehiclesModule } from './vehicles/vehicles.module.js';
import { WebhooksModule } from './webhooks/webhooks.module.js';
import { WorkModule } from './work/work.module.js';

/** The front ends: kiosk under /kiosk, the board (wall and office) at the root, each falling back to its index.html. */
function frontEnds(staticRoot: string): DynamicModule[] {
  return [
    ServeStaticModule.forRoot(
      { rootPath: join(staticRoot, 'kiosk', 'dist'), serveRoot: '/kiosk', exclude: ['/api/{*path}'] },
      { rootPath: join(staticRoot, 'board', 'dist'), exclude: ['/api/{*path}', '/kiosk/{*path}'] },
    ),
  ];
}

@Module({})
export class AppModule {
  static forRoot(config: AppConfig): DynamicModule {
    return {
      module: AppModule,
      global: true,
      providers: [{ provide: APP_CONFIG, useValue: config }],
      exports: [APP_CONFIG],
      imports: [
        ScheduleModule.forRoot(),
        DatabaseModule,
        AuditModule,
        LiveModule,
        AuthModule,
        ShopModule,
        PayrollModule,
        LabourModule,
        UsersModule,
        BaysModule,
        ScreensModule,
        KiosksModule,
        BoardModule,
        PunchesModule,
        WorkModule,
        RepairOrderImportModule,
        VehiclesModule,
        TimecardsModule,
        ReportsModule,
        PayWeeksModule,
        PayrollExportModule,
        TimersModule,
        DispatchModule,
        FindingsModule,
        ApprovalsModule,
        HealthModule,
        WebhooksModule,
        BackupModule,
        DemoModule,
        ...(config.staticRoot ? frontEnds(config.staticRoot) : []),
      ],
    };
  }
}
