import { createHash, randomBytes } from 'node:crypto';
import { BadRequestException, Inject, Injectable, UnauthorizedException } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { ChangePasswordRequest, LoginRequest, LoginResponse, SessionUser } from '@stormhour/shared';
import { AuditService } from '../audit/audit.service.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { hashPassword, UNKNOWN_USER_HASH, verifyPassword } from '../users/passwords.js';
import { type UserRow, UsersRepository } from '../users/users.repository.js';
import { SessionsRepository } from './sessions.repository.js';

/** What the access token carries. `ver` must equal the user's token version for it to count. */
export interface AccessTokenPayload {
  sub: number;
  role: SessionUser['role'];
  ver: number;
}

export interface IssuedSession extends LoginResponse {
  refreshToken: string;
  refreshExpires: Date;
}

/** Deliberately the same for an unknown e-mail, a wrong password and a deactivated account. */
export const SIGN_IN_FAILED = 'Email or password is incorrect, or the account is not active.';

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

export function toSessionUser(u: UserRow): SessionUser {
  return { id: u.id, email: u.email, name: u.name, role: u.role, districtId: u.districtId };
}

@Injectable()
export class AuthService {
  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly jwt: JwtService,
    private readonly users: UsersRepository,
    private readonly sessions: SessionsRepository,
    private readonly audit: AuditService,
  ) {}

  async login(req: LoginRequest): Promise<IssuedSession> {
    const user = await this.users.findByEmail(req.email);
    const passwordOk = await verifyPassword(req.password, user?.passwordHash ?? UNKNOWN_USER_HASH);
    if (!user || !passwordOk || !user.active) {
      await this.audit.record(
        user ? toSessionUser(user) : null,
        'auth.sign-in-failed',
        `email:${req.email}`,
        {
          reason: !user ? 'unknown e-mail' : !passwordOk ? 'wrong password' : 'account deactivated',
        },
      );
      throw new UnauthorizedException(SIGN_IN_FAILED);
    }
    return this.sessions.transaction(async (tx) => {
      const signedIn = await this.users.update(user.id, { lastSignInAt: new Date() }, tx);
      await this.audit.record(toSessionUser(user), 'auth.sign-in', `user:${user.id}`, null, tx);
      return this.issue(signedIn, tx);
    });
  }

  /** Trades a live refresh token for a new pair; the old refresh token is spent (rotation). */
  async refresh(refreshToken: string | undefined): Promise<IssuedSession> {
    if (!refreshToken) throw new UnauthorizedException('No session to restore: sign in.');
    return this.sessions.transaction(async (tx) => {
      const session = await this.sessions.findLive(sha256(refreshToken), tx);
      if (!session) throw new UnauthorizedException('The session has ended: sign in again.');
      await this.sessions.revoke(session.id, tx);
      const user = await this.users.findById(session.userId, tx);
      if (!user?.active) throw new UnauthorizedException('The account is not active.');
      return this.issue(user, tx);
    });
  }

  async logout(user: SessionUser, refreshToken: string | undefined): Promise<void> {
    await this.sessions.transaction(async (tx) => {
      if (refreshToken) {
        const session = await this.sessions.findLive(sha256(refreshToken), tx);
        if (session) await this.sessions.revoke(session.id, tx);
      }
      await this.audit.record(user, 'auth.sign-out', `user:${user.id}`, null, tx);
    });
  }

  async changePassword(user: SessionUser, req: ChangePasswordRequest): Promise<void> {
    const row = await this.users.findById(user.id);
    if (!row || !(await verifyPassword(req.currentPassword, row.passwordHash))) {
      throw new BadRequestException({
        message: 'The current password is not correct.',
        details: [{ where: 'currentPassword', problem: 'does not match' }],
      });
    }
    if (req.currentPassword === req.newPassword) {
      throw new BadRequestException({
        message: 'The new password must differ from the current one.',
        details: [{ where: 'newPassword', problem: 'same as the current password' }],
      });
    }
    const passwordHash = await hashPassword(req.newPassword);
    await this.users.transaction(async (tx) => {
      await this.users.update(user.id, { passwordHash }, tx);
      // Other devices signed in with the old password must sign in again.
      await this.sessions.revokeAllOf(user.id, tx);
      await this.audit.record(user, 'auth.password-change', `user:${user.id}`, null, tx);
    });
  }

  /** Checks a verified token's claims against the stored user; used by the JWT strategy. */
  async userForToken(payload: AccessTokenPayload): Promise<SessionUser> {
    const user = await this.users.findForSession(payload.sub);
    if (!user?.active || user.tokenVersion !== payload.ver) {
      throw new UnauthorizedException('This session is no longer valid: sign in again.');
    }
    return toSessionUser(user);
  }

  private async issue(
    user: UserRow,
    tx: Parameters<SessionsRepository['insert']>[3],
  ): Promise<IssuedSession> {
    const payload: AccessTokenPayload = { sub: user.id, role: user.role, ver: user.tokenVersion };
    const expiresIn = this.config.accessTokenMinutes * 60;
    const accessToken = await this.jwt.signAsync(payload, { expiresIn });
    const refreshToken = randomBytes(32).toString('base64url');
    const refreshExpires = new Date(Date.now() + this.config.refreshDays * 86_400_000);
    await this.sessions.insert(user.id, sha256(refreshToken), refreshExpires, tx);
    return { accessToken, expiresIn, user: toSessionUser(user), refreshToken, refreshExpires };
  }
}
