import { Inject, Injectable } from '@nestjs/common';
import type { Role } from '@stormhour/shared';
import { and, asc, eq, ilike, or, type SQL, sql } from 'drizzle-orm';
import { DATABASE, type DatabaseHandle, type Executor } from '../database/database.js';
import { users } from '../database/schema.js';

export type UserRow = typeof users.$inferSelect;
export type NewUserRow = typeof users.$inferInsert;

@Injectable()
export class UsersRepository {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  async findByEmail(email: string): Promise<UserRow | undefined> {
    const [row] = await this.handle.db.select().from(users).where(eq(users.email, email));
    return row;
  }

  async findById(id: number, executor: Executor = this.handle.db): Promise<UserRow | undefined> {
    const [row] = await executor.select().from(users).where(eq(users.id, id));
    return row;
  }

  list(filter: { q?: string; role?: Role }): Promise<UserRow[]> {
    const conditions: SQL[] = [];
    if (filter.role) conditions.push(eq(users.role, filter.role));
    if (filter.q) {
      const like = `%${filter.q}%`;
      const match = or(ilike(users.email, like), ilike(users.name, like));
      if (match) conditions.push(match);
    }
    return this.handle.db
      .select()
      .from(users)
      .where(and(...conditions))
      .orderBy(asc(users.email));
  }

  async insert(row: NewUserRow, executor: Executor = this.handle.db): Promise<UserRow> {
    const [created] = await executor.insert(users).values(row).returning();
    return created;
  }

  async update(
    id: number,
    changes: Partial<NewUserRow>,
    executor: Executor = this.handle.db,
  ): Promise<UserRow> {
    const [updated] = await executor.update(users).set(changes).where(eq(users.id, id)).returning();
    return updated;
  }

  async bumpTokenVersion(id: number, executor: Executor = this.handle.db): Promise<void> {
    await executor
      .update(users)
      .set({ tokenVersion: sql`${users.tokenVersion} + 1` })
      .where(eq(users.id, id));
  }

  async count(): Promise<number> {
    const [{ n }] = await this.handle.db.select({ n: sql<number>`count(*)::int` }).from(users);
    return n;
  }

  transaction<T>(work: (tx: Executor) => Promise<T>): Promise<T> {
    return this.handle.db.transaction(work);
  }
}
