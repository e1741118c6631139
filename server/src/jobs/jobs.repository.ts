import { Inject, Injectable } from '@nestjs/common';
import { desc, eq, inArray } from 'drizzle-orm';
import { DATABASE, type DatabaseHandle, type Executor } from '../database/database.js';
import { jobs } from '../database/schema.js';

export type JobRow = typeof jobs.$inferSelect;
export type NewJobRow = typeof jobs.$inferInsert;

@Injectable()
export class JobsRepository {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  async insert(row: NewJobRow, executor: Executor = this.handle.db): Promise<JobRow> {
    const [created] = await executor.insert(jobs).values(row).returning();
    return created;
  }

  async find(id: number): Promise<JobRow | undefined> {
    const [row] = await this.handle.db.select().from(jobs).where(eq(jobs.id, id));
    return row;
  }

  list(limit: number): Promise<JobRow[]> {
    return this.handle.db.select().from(jobs).orderBy(desc(jobs.createdAt), desc(jobs.id)).limit(limit);
  }

  async update(id: number, changes: Partial<NewJobRow>, executor: Executor = this.handle.db): Promise<void> {
    await executor.update(jobs).set(changes).where(eq(jobs.id, id));
  }

  async unfinished(): Promise<JobRow[]> {
    return this.handle.db
      .select()
      .from(jobs)
      .where(inArray(jobs.state, ['queued', 'running']))
      .orderBy(jobs.id);
  }
}
