import { Body, Controller, Get, Headers, HttpCode, Ip, Post, UseGuards } from '@nestjs/common';
import { Throttle, ThrottlerGuard } from '@nestjs/throttler';
import {
  badgeLoginSchema,
  loginSchema,
  pairScreenSchema,
  type AuthUser,
  type BadgeLoginBody,
  type LoginBody,
  type OfficeSignInAnswer,
  type PairScreenBody,
  type SignInAnswer,
} from '@baytime/shared';
import { CurrentUser, Public, Roles } from '../common/decorators/auth.decorators.js';
import { bearerToken } from '../common/guards/auth.guard.js';
import { AuthService } from './auth.service.js';
import type { Principal } from './principal.js';

@Controller()
export class AuthController {
  constructor(private readonly auth: AuthService) {}

  @Public()
  @UseGuards(ThrottlerGuard)
  @Throttle({ default: { limit: 60, ttl: 60_000 } })
  @Post('auth/login')
  @HttpCode(200)
  login(@Body({ schema: loginSchema }) body: LoginBody, @Ip() ip: string): Promise<OfficeSignInAnswer> {
    return this.auth.login(body, ip);
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @Throttle({ default: { limit: 60, ttl: 60_000 } })
  @Post('auth/badge')
  @HttpCode(200)
  badge(@Body({ schema: badgeLoginSchema }) body: BadgeLoginBody, @Ip() ip: string): Promise<SignInAnswer> {
    return this.auth.badge(body, ip);
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @Throttle({ default: { limit: 30, ttl: 60_000 } })
  @Post('auth/screens/pair')
  @HttpCode(200)
  pair(@Body({ schema: pairScreenSchema }) body: PairScreenBody): { accessToken: string } {
    return this.auth.pairScreen(body);
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @Throttle({ default: { limit: 30, ttl: 60_000 } })
  @Post('auth/kiosks/pair')
  @HttpCode(200)
  pairKiosk(@Body({ schema: pairScreenSchema }) body: PairScreenBody): { accessToken: string } {
    return this.auth.pairScreen(body, 'kiosk');
  }

  /** A fresh token for an office sign-in in use, so a long day does not end on the sign-in page. */
  @Roles('owner', 'foreman', 'advisor')
  @Post('auth/renew')
  @HttpCode(200)
  renew(@Headers('authorization') authorization: string | undefined): OfficeSignInAnswer {
    return this.auth.renew(bearerToken(authorization));
  }

  @Get('me')
  me(@CurrentUser() user: Principal): AuthUser {
    return user;
  }
}
