import { Inject, Injectable } from '@nestjs/common';
import { and, eq, gt, isNull } from 'drizzle-orm';
import { DATABASE, type DatabaseHandle, type Executor } from '../database/database.js';
import { sessions } from '../database/schema.js';

@Injectable()
export class SessionsRepository {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  async insert(
    userId: number,
    tokenHash: string,
    expiresAt: Date,
    executor: Executor = this.handle.db,
  ): Promise<void> {
    await executor.insert(sessions).values({ userId, tokenHash, expiresAt });
  }

  /** The live session with this token hash, if any. */
  async findLive(tokenHash: string, executor: Executor = this.handle.db) {
    const [row] = await executor
      .select()
      .from(sessions)
      .where(
        and(
          eq(sessions.tokenHash, tokenHash),
          isNull(sessions.revokedAt),
          gt(sessions.expiresAt, new Date()),
        ),
      );
    return row;
  }

  async revoke(id: number, executor: Executor = this.handle.db): Promise<void> {
    await executor.update(sessions).set({ revokedAt: new Date() }).where(eq(sessions.id, id));
  }

  async revokeAllOf(userId: number, executor: Executor = this.handle.db): Promise<void> {
    await executor
      .update(sessions)
      .set({ revokedAt: new Date() })
      .where(and(eq(sessions.userId, userId), isNull(sessions.revokedAt)));
  }

  transaction<T>(work: (tx: Executor) => Promise<T>): Promise<T> {
    return this.handle.db.transaction(work);
  }
}
