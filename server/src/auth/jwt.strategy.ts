import { Inject, Injectable } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';
import { AuthService } from './auth.service.js';
import type { Principal, TokenPayload } from './principal.js';

@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy) {
  constructor(
    @Inject(APP_CONFIG) config: AppConfig,
    private readonly auth: AuthService,
  ) {
    super({
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      // jsonwebtoken takes a key object; the passport-jwt types only list strings and buffers.
      secretOrKey: config.jwtKey as unknown as Buffer,
      algorithms: ['HS256'],
    });
  }

  /**
   * passport answers 401 when this returns false: a deactivated user, a revoked screen, or a token
   * without an expiry.
   */
  validate(payload: TokenPayload): Principal | false {
    const checked = this.auth.checkPayload(payload);
    return 'principal' in checked ? checked.principal : false;
  }
}
