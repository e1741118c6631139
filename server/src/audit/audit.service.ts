import { Injectable } from '@nestjs/common';
import type { AuditEntry, Page, SessionUser } from '@stormhour/shared';
import type { Executor } from '../database/database.js';
import { AuditRepository } from './audit.repository.js';

/** Actions are dotted names: auth.sign-in, auth.sign-in-failed, user.create, blocks.import, … */
@Injectable()
export class AuditService {
  constructor(private readonly repo: AuditRepository) {}

  record(
    actor: Pick<SessionUser, 'id' | 'email'> | null,
    action: string,
    target: string | null,
    detail: Record<string, unknown> | null = null,
    executor?: Executor,
  ): Promise<void> {
    return this.repo.insert(
      { actorId: actor?.id ?? null, actorEmail: actor?.email ?? null, action, target, detail },
      executor,
    );
  }

  page(offset: number, limit: number, action?: string): Promise<Page<AuditEntry>> {
    return this.repo.page(offset, limit, action);
  }

  actions(): Promise<string[]> {
    return this.repo.actions();
  }
}
