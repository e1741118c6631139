import { Inject, Injectable } from '@nestjs/common';
import type { AuditEntry, Page } from '@stormhour/shared';
import { count, desc, eq } from 'drizzle-orm';
import { DATABASE, type DatabaseHandle, type Executor } from '../database/database.js';
import { auditLog } from '../database/schema.js';

export interface NewAuditEntry {
  actorId: number | null;
  actorEmail: string | null;
  action: string;
  target?: string | null;
  detail?: Record<string, unknown> | null;
}

@Injectable()
export class AuditRepository {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  async insert(entry: NewAuditEntry, executor: Executor = this.handle.db): Promise<void> {
    await executor.insert(auditLog).values({
      actorId: entry.actorId,
      actorEmail: entry.actorEmail,
      action: entry.action,
      target: entry.target ?? null,
      detail: entry.detail ?? null,
    });
  }

  async page(offset: number, limit: number, action?: string): Promise<Page<AuditEntry>> {
    const where = action ? eq(auditLog.action, action) : undefined;
    const [rows, [{ total }]] = await Promise.all([
      this.handle.db
        .select()
        .from(auditLog)
        .where(where)
        .orderBy(desc(auditLog.at), desc(auditLog.id))
        .offset(offset)
        .limit(limit),
      this.handle.db.select({ total: count() }).from(auditLog).where(where),
    ]);
    return {
      items: rows.map((r) => ({ ...r, at: r.at.toISOString() })),
      total,
      offset,
      limit,
    };
  }

  async actions(): Promise<string[]> {
    const rows = await this.handle.db
      .selectDistinct({ action: auditLog.action })
      .from(auditLog)
      .orderBy(auditLog.action);
    return rows.map((r) => r.action);
  }
}
