import { Module } from '@nestjs/common';
import { APP_GUARD } from '@nestjs/core';
import { JwtModule } from '@nestjs/jwt';
import { ThrottlerModule } from '@nestjs/throttler';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';
import { SignedInGuard } from '../common/guards/auth.guard.js';
import { IntegrationKeysModule } from '../integration-keys/integration-keys.module.js';
import { AuthController } from './auth.controller.js';
import { AuthService } from './auth.service.js';
import { SignInThrottle } from './sign-in-throttle.js';

@Module({
  imports: [
    IntegrationKeysModule,
    ThrottlerModule.forRoot({
      throttlers: [{ ttl: 60_000, limit: 60 }],
      errorMessage: 'Too many requests. Try again in a minute.',
    }),
    JwtModule.registerAsync({
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig) => ({
        secret: config.jwtKey,
        signOptions: { algorithm: 'HS256' },
        verifyOptions: { algorithms: ['HS256'] },
      }),
    }),
  ],
  controllers: [AuthController],
  providers: [AuthService, SignInThrottle, { provide: APP_GUARD, useClass: SignedInGuard }],
  exports: [AuthService],
})
export class AuthModule {}
