import { Injectable } from '@nestjs/common';
import { ThrottlerException, ThrottlerGuard } from '@nestjs/throttler';

/** Limits sign-in attempts per address and e-mail, so guessing one account's password is slow. */
@Injectable()
export class LoginThrottleGuard extends ThrottlerGuard {
  protected override async getTracker(req: Record<string, unknown>): Promise<string> {
    const body = req.body as { email?: unknown } | undefined;
    const email = typeof body?.email === 'string' ? body.email.trim().toLowerCase() : '';
    return `${String(req.ip)}|${email}`;
  }

  protected override async throwThrottlingException(): Promise<void> {
    throw new ThrottlerException('Too many sign-in attempts. Wait a minute, then try again.');
  }
}
