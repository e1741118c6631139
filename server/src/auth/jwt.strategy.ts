import { createSecretKey } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import type { SessionUser } from '@stormhour/shared';
import { ExtractJwt, Strategy } from 'passport-jwt';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { type AccessTokenPayload, AuthService } from './auth.service.js';

@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy, 'jwt') {
  constructor(
    @Inject(APP_CONFIG) config: AppConfig,
    private readonly auth: AuthService,
  ) {
    super({
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      // A key object, not the string: given a string or a Buffer, jsonwebtoken first tries to read it
      // as a public key and catches the failure, on every request (over a millisecond each, most of a
      // cached answer's cost). jsonwebtoken takes a KeyObject; passport-jwt's types only say so narrowly.
      secretOrKey: createSecretKey(Buffer.from(config.jwtSecret)) as unknown as Buffer,
      algorithms: ['HS256'],
      ignoreExpiration: false,
    });
  }

  validate(payload: AccessTokenPayload): Promise<SessionUser> {
    return this.auth.userForToken(payload);
  }
}
