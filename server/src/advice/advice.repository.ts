import { Inject, Injectable } from '@nestjs/common';
import type { AdviceRuleRequest, AdviceRuleView, CropStageEntry } from '@stormhour/shared';
import { asc, count, eq, inArray } from 'drizzle-orm';
import { DATABASE, type DatabaseHandle, type Executor } from '../database/database.js';
import { adviceRules, cropCalendarEntries, districts, users } from '../database/schema.js';

/** Crop calendars and advice rules: the only code that touches their tables. */
@Injectable()
export class AdviceRepository {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  transaction<T>(work: (tx: Executor) => Promise<T>): Promise<T> {
    return this.handle.db.transaction(work);
  }

  async calendarOf(districtId: number): Promise<{ entries: CropStageEntry[]; updatedAt: string | null }> {
    const rows = await this.handle.db
      .select()
      .from(cropCalendarEntries)
      .where(eq(cropCalendarEntries.districtId, districtId))
      .orderBy(asc(cropCalendarEntries.position));
    const latest = rows.reduce<Date | null>(
      (m, r) => (m === null || r.updatedAt > m ? r.updatedAt : m),
      null,
    );
    return {
      entries: rows.map((r) => ({ crop: r.crop, stage: r.stage, fromWeek: r.fromWeek, toWeek: r.toWeek })),
      updatedAt: latest?.toISOString() ?? null,
    };
  }

  /** Replaces a district's whole calendar; call inside a transaction. */
  async replaceCalendar(districtId: number, entries: CropStageEntry[], tx: Executor): Promise<void> {
    await tx.delete(cropCalendarEntries).where(eq(cropCalendarEntries.districtId, districtId));
    // Guard against an empty list, which would make invalid SQL.
    if (entries.length === 0) return;
    await tx
      .insert(cropCalendarEntries)
      .values(entries.map((e, position) => ({ ...e, districtId, position, updatedAt: new Date() })));
  }

  async districtIdsByCode(codes: string[], tx: Executor): Promise<Map<string, number>> {
    if (codes.length === 0) return new Map();
    const rows = await tx
      .select({ id: districts.id, code: districts.code })
      .from(districts)
      .where(inArray(districts.code, codes));
    return new Map(rows.map((r) => [r.code, r.id]));
  }

  async listRules(): Promise<AdviceRuleView[]> {
    const rows = await this.handle.db
      .select({ rule: adviceRules, updatedBy: users.email })
      .from(adviceRules)
      .leftJoin(users, eq(users.id, adviceRules.updatedBy))
      .orderBy(asc(adviceRules.priority), asc(adviceRules.id));
    return rows.map(({ rule, updatedBy }) => ({
      id: rule.id,
      crop: rule.crop,
      stage: rule.stage,
      condition: rule.condition,
      priority: rule.priority,
      text: rule.text,
      source: rule.source,
      active: rule.active,
      origin: rule.origin,
      updatedAt: rule.updatedAt.toISOString(),
      updatedBy,
    }));
  }

  async ruleExists(id: number): Promise<boolean> {
    const [row] = await this.handle.db
      .select({ id: adviceRules.id })
      .from(adviceRules)
      .where(eq(adviceRules.id, id));
    return row !== undefined;
  }

  async ruleCount(): Promise<number> {
    const [row] = await this.handle.db.select({ n: count() }).from(adviceRules);
    return row.n;
  }

  async insertRule(
    rule: AdviceRuleRequest,
    origin: 'default' | 'unit',
    updatedBy: number | null,
    tx: Executor,
  ): Promise<number> {
    const [row] = await tx
      .insert(adviceRules)
      .values({ ...rule, origin, updatedBy })
      .returning({ id: adviceRules.id });
    return row.id;
  }

  async updateRule(id: number, rule: AdviceRuleRequest, updatedBy: number, tx: Executor): Promise<void> {
    await tx
      .update(adviceRules)
      .set({ ...rule, updatedBy, updatedAt: new Date() })
      .where(eq(adviceRules.id, id));
  }
}
