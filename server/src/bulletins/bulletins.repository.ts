import { Inject, Injectable } from '@nestjs/common';
import type { BulletinContent, BulletinState, BulletinTransition } from '@stormhour/shared';
import { and, asc, count, desc, eq, inArray, isNull, ne, type SQL } from 'drizzle-orm';
import { DATABASE, type DatabaseHandle, type Executor } from '../database/database.js';
import {
  blocks,
  bulletinEvents,
  bulletinReads,
  bulletins,
  bulletinVersions,
  districts,
  fieldReports,
  users,
} from '../database/schema.js';

export type BulletinRow = typeof bulletins.$inferSelect;
export type NewBulletinRow = typeof bulletins.$inferInsert;
export type BulletinWithNames = BulletinRow & {
  districtCode: string;
  districtName: string;
  authorEmail: string;
};
export type FieldReportRow = typeof fieldReports.$inferSelect & {
  blockCode: string;
  blockName: string;
  officerEmail: string;
};

/** Bulletins, their versions, history, reads and field reports: the only code touching those tables. */
@Injectable()
export class BulletinsRepository {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  transaction<T>(work: (tx: Executor) => Promise<T>): Promise<T> {
    return this.handle.db.transaction(work);
  }

  private selectWithNames(executor: Executor = this.handle.db) {
    return executor
      .select({
        bulletin: bulletins,
        districtCode: districts.code,
        districtName: districts.name,
        authorEmail: users.email,
      })
      .from(bulletins)
      .innerJoin(districts, eq(districts.id, bulletins.districtId))
      .innerJoin(users, eq(users.id, bulletins.authorId));
  }

  async list(filter: { districtId?: number; state?: BulletinState; states?: BulletinState[] }) {
    const where: SQL[] = [];
    if (filter.districtId) where.push(eq(bulletins.districtId, filter.districtId));
    if (filter.state) where.push(eq(bulletins.state, filter.state));
    if (filter.states) where.push(inArray(bulletins.state, filter.states));
    const rows = await this.selectWithNames()
      .where(and(...where))
      .orderBy(desc(bulletins.weekStart), asc(districts.name), desc(bulletins.id));
    return rows.map(flatten);
  }

  async find(id: number, executor: Executor = this.handle.db): Promise<BulletinWithNames | undefined> {
    const [row] = await this.selectWithNames(executor).where(eq(bulletins.id, id));
    return row ? flatten(row) : undefined;
  }

  /** The live (not withdrawn) bulletin of a district and week, if any. */
  async liveFor(districtId: number, weekStart: string, executor: Executor = this.handle.db) {
    const [row] = await executor
      .select()
      .from(bulletins)
      .where(
        and(
          eq(bulletins.districtId, districtId),
          eq(bulletins.weekStart, weekStart),
          ne(bulletins.state, 'withdrawn'),
        ),
      );
    return row;
  }

  async withdrawnCount(districtId: number, weekStart: string, executor: Executor): Promise<number> {
    const [row] = await executor
      .select({ n: count() })
      .from(bulletins)
      .where(
        and(
          eq(bulletins.districtId, districtId),
          eq(bulletins.weekStart, weekStart),
          eq(bulletins.state, 'withdrawn'),
        ),
      );
    return row.n;
  }

  async insert(row: NewBulletinRow, tx: Executor): Promise<BulletinRow> {
    const [created] = await tx.insert(bulletins).values(row).returning();
    return created;
  }

  /**
   * Moves a bulletin on only from the state it was read in: a concurrent change makes this return false
   * and the caller refuses, so two reviewers cannot both act on the same state.
   */
  async update(
    id: number,
    expectedState: BulletinState,
    set: Partial<NewBulletinRow>,
    tx: Executor,
  ): Promise<boolean> {
    const rows = await tx
      .update(bulletins)
      .set({ ...set, updatedAt: new Date() })
      .where(and(eq(bulletins.id, id), eq(bulletins.state, expectedState)))
      .returning({ id: bulletins.id });
    return rows.length === 1;
  }

  async insertVersion(
    bulletinId: number,
    version: number,
    content: BulletinContent,
    savedBy: number,
    tx: Executor,
  ): Promise<void> {
    await tx.insert(bulletinVersions).values({ bulletinId, version, content, savedBy });
  }

  async versions(bulletinId: number) {
    return this.handle.db
      .select({ version: bulletinVersions.version, savedBy: users.email, savedAt: bulletinVersions.savedAt })
      .from(bulletinVersions)
      .innerJoin(users, eq(users.id, bulletinVersions.savedBy))
      .where(eq(bulletinVersions.bulletinId, bulletinId))
      .orderBy(asc(bulletinVersions.version));
  }

  async version(bulletinId: number, version: number, executor: Executor = this.handle.db) {
    const [row] = await executor
      .select({
        version: bulletinVersions.version,
        content: bulletinVersions.content,
        savedBy: users.email,
        savedAt: bulletinVersions.savedAt,
      })
      .from(bulletinVersions)
      .innerJoin(users, eq(users.id, bulletinVersions.savedBy))
      .where(and(eq(bulletinVersions.bulletinId, bulletinId), eq(bulletinVersions.version, version)));
    return row;
  }

  async addEvent(
    event: {
      bulletinId: number;
      transition: BulletinTransition;
      fromState: BulletinState | null;
      toState: BulletinState;
      actorId: number;
      comment: string | null;
    },
    tx: Executor,
  ): Promise<void> {
    await tx.insert(bulletinEvents).values(event);
  }

  async events(bulletinId: number) {
    return this.handle.db
      .select({
        transition: bulletinEvents.transition,
        from: bulletinEvents.fromState,
        to: bulletinEvents.toState,
        actor: users.email,
        at: bulletinEvents.at,
        comment: bulletinEvents.comment,
      })
      .from(bulletinEvents)
      .innerJoin(users, eq(users.id, bulletinEvents.actorId))
      .where(eq(bulletinEvents.bulletinId, bulletinId))
      .orderBy(asc(bulletinEvents.at), asc(bulletinEvents.id));
  }

  /** The district's newest sent (or since withdrawn) bulletin of an earlier week than the given one. */
  async previousSent(districtId: number, beforeWeek: string, exceptId: number) {
    const rows = await this.selectWithNames()
      .where(
        and(
          eq(bulletins.districtId, districtId),
          inArray(bulletins.state, ['sent', 'withdrawn']),
          ne(bulletins.id, exceptId),
        ),
      )
      .orderBy(desc(bulletins.weekStart), desc(bulletins.sentAt));
    return rows.map(flatten).find((b) => b.weekStart <= beforeWeek && b.approvedVersion !== null);
  }

  /** Active extension officers of a district: who a bulletin goes to. */
  async officersOf(districtId: number, executor: Executor = this.handle.db) {
    return executor
      .select({ id: users.id, email: users.email, name: users.name })
      .from(users)
      .where(and(eq(users.districtId, districtId), eq(users.role, 'officer'), eq(users.active, true)))
      .orderBy(asc(users.email));
  }

  async blocksOf(districtId: number) {
    return this.handle.db
      .select({ id: blocks.id, code: blocks.code, name: blocks.name })
      .from(blocks)
      .where(eq(blocks.districtId, districtId))
      .orderBy(asc(blocks.code));
  }

  async readsOf(officerId: number, bulletinIds: number[]) {
    if (bulletinIds.length === 0) return [];
    return this.handle.db
      .select()
      .from(bulletinReads)
      .where(and(eq(bulletinReads.officerId, officerId), inArray(bulletinReads.bulletinId, bulletinIds)));
  }

  /** Records the first opening (later openings keep the first time); acknowledging also counts as reading. */
  async markRead(bulletinId: number, officerId: number, acknowledge: boolean, tx: Executor): Promise<void> {
    const now = new Date();
    await tx
      .insert(bulletinReads)
      .values({ bulletinId, officerId, readAt: now, acknowledgedAt: acknowledge ? now : null })
      .onConflictDoNothing();
    if (acknowledge)
      await tx
        .update(bulletinReads)
        .set({ acknowledgedAt: now })
        .where(
          and(
            eq(bulletinReads.bulletinId, bulletinId),
            eq(bulletinReads.officerId, officerId),
            // The first acknowledgement is the one kept.
            isNull(bulletinReads.acknowledgedAt),
          ),
        );
  }

  async insertReport(row: typeof fieldReports.$inferInsert, tx: Executor): Promise<number> {
    const [created] = await tx.insert(fieldReports).values(row).returning({ id: fieldReports.id });
    return created.id;
  }

  async reports(filter: { bulletinId: number; officerId?: number }): Promise<FieldReportRow[]> {
    const where = [eq(fieldReports.bulletinId, filter.bulletinId)];
    if (filter.officerId) where.push(eq(fieldReports.officerId, filter.officerId));
    const rows = await this.handle.db
      .select({
        report: fieldReports,
        blockCode: blocks.code,
        blockName: blocks.name,
        officerEmail: users.email,
      })
      .from(fieldReports)
      .innerJoin(blocks, eq(blocks.id, fieldReports.blockId))
      .innerJoin(users, eq(users.id, fieldReports.officerId))
      .where(and(...where))
      .orderBy(asc(fieldReports.at), asc(fieldReports.id));
    return rows.map(({ report, ...names }) => ({ ...report, ...names }));
  }

  async reportCounts(officerId: number, bulletinIds: number[]): Promise<Map<number, number>> {
    if (bulletinIds.length === 0) return new Map();
    const rows = await this.handle.db
      .select({ bulletinId: fieldReports.bulletinId, n: count() })
      .from(fieldReports)
      .where(and(eq(fieldReports.officerId, officerId), inArray(fieldReports.bulletinId, bulletinIds)))
      .groupBy(fieldReports.bulletinId);
    return new Map(rows.map((r) => [r.bulletinId, r.n]));
  }
}

function flatten(row: {
  bulletin: BulletinRow;
  districtCode: string;
  districtName: string;
  authorEmail: string;
}): BulletinWithNames {
  return {
    ...row.bulletin,
    districtCode: row.districtCode,
    districtName: row.districtName,
    authorEmail: row.authorEmail,
  };
}
