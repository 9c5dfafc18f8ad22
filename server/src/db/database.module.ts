import { Global, Inject, Module, type OnApplicationShutdown } from '@nestjs/common';
import { APP_INTERCEPTOR } from '@nestjs/core';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';
import { DB, openDatabase, SQLITE, type Sqlite, type Db } from './database.js';
import { UnitOfWork } from './unit-of-work.js';
import { DurableAnswerInterceptor, WalSync } from './wal-sync.js';

@Global()
@Module({
  providers: [
    {
      provide: SQLITE,
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig): Sqlite => openDatabase(config.dbFile),
    },
    { provide: DB, inject: [SQLITE], useFactory: (sqlite: Sqlite): Db => sqlite.db },
    UnitOfWork,
    WalSync,
    { provide: APP_INTERCEPTOR, useClass: DurableAnswerInterceptor },
  ],
  exports: [DB, SQLITE, UnitOfWork, WalSync],
})
export class DatabaseModule implements OnApplicationShutdown {
  constructor(@Inject(SQLITE) private readonly sqlite: Sqlite) {}

  onApplicationShutdown(): void {
    if (this.sqlite.connection.open) this.sqlite.connection.close();
  }
}
