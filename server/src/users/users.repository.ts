import { Inject, Injectable } from '@nestjs/common';
import type { Role } from '@stormhour/shared';
import { and, asc, eq, ilike, or, type SQL, sql } from 'drizzle-orm';
import { DATABASE, type DatabaseHandle, type Executor } from '../database/database.js';
import { users } from '../database/schema.js';

export type UserRow = typeof users.$inferSelect;
export type NewUserRow = typeof users.$inferInsert;

/**
 * How long a user row read for checking an access token is reused. Every change made here (role,
 * active, password, token version) drops the cache at once, so this only bounds how late a change made
 * around this repository (by hand in SQL) is seen.
 */
export const SESSION_USER_TTL_MS = 5000;

@Injectable()
export class UsersRepository {
  /** Rows read by findForSession, by id; cleared by every write below. */
  private readonly sessionUsers = new Map<number, { row: UserRow | undefined; readAt: number }>();
  /** Moves on every write, so a read that began before a write does not put its stale row back. */
  private generation = 0;

  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  /**
   * The user an access token names, as checked on every authenticated request: read from the database
   * at most every SESSION_USER_TTL_MS per user, and again straight after any change to users.
   */
  async findForSession(id: number): Promise<UserRow | undefined> {
    const hit = this.sessionUsers.get(id);
    if (hit && Date.now() - hit.readAt < SESSION_USER_TTL_MS) return hit.row;
    const generation = this.generation;
    const readAt = Date.now();
    const row = await this.findById(id);
    if (generation === this.generation) this.sessionUsers.set(id, { row, readAt });
    return row;
  }

  /** Called before and after every write: a read racing the write cannot keep the old row. */
  private forgetSessionUsers(): void {
    this.generation++;
    this.sessionUsers.clear();
  }

  private async writing<T>(work: () => PromiseLike<T>): Promise<T> {
    this.forgetSessionUsers();
    try {
      return await work();
    } finally {
      this.forgetSessionUsers();
    }
  }

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
    const [created] = await this.writing(() => executor.insert(users).values(row).returning());
    return created;
  }

  async update(
    id: number,
    changes: Partial<NewUserRow>,
    executor: Executor = this.handle.db,
  ): Promise<UserRow> {
    const [updated] = await this.writing(() =>
      executor.update(users).set(changes).where(eq(users.id, id)).returning(),
    );
    return updated;
  }

  async bumpTokenVersion(id: number, executor: Executor = this.handle.db): Promise<void> {
    await this.writing(() =>
      executor
        .update(users)
        .set({ tokenVersion: sql`${users.tokenVersion} + 1` })
        .where(eq(users.id, id)),
    );
  }

  async count(): Promise<number> {
    const [{ n }] = await this.handle.db.select({ n: sql<number>`count(*)::int` }).from(users);
    return n;
  }

  transaction<T>(work: (tx: Executor) => Promise<T>): Promise<T> {
    return this.handle.db.transaction(work);
  }
}
