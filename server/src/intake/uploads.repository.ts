import { Inject, Injectable } from '@nestjs/common';
import { and, eq, inArray, isNull } from 'drizzle-orm';
import { DATABASE, type DatabaseHandle, type Executor } from '../database/database.js';
import { uploads } from '../database/schema.js';

export type UploadRow = typeof uploads.$inferSelect;

@Injectable()
export class UploadsRepository {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  async findByContent(siteId: number, kind: string, sha256: string): Promise<UploadRow | undefined> {
    const [row] = await this.handle.db
      .select()
      .from(uploads)
      .where(and(eq(uploads.siteId, siteId), eq(uploads.kind, kind), eq(uploads.sha256, sha256)));
    return row;
  }

  async find(id: number): Promise<UploadRow | undefined> {
    const [row] = await this.handle.db.select().from(uploads).where(eq(uploads.id, id));
    return row;
  }

  async insert(row: typeof uploads.$inferInsert): Promise<UploadRow> {
    const [created] = await this.handle.db.insert(uploads).values(row).returning();
    return created;
  }

  async attachToJob(ids: number[], jobId: number): Promise<void> {
    if (ids.length) await this.handle.db.update(uploads).set({ jobId }).where(inArray(uploads.id, ids));
  }

  async markImported(id: number, tx: Executor): Promise<void> {
    await tx
      .update(uploads)
      .set({ importedAt: new Date() })
      .where(and(eq(uploads.id, id), isNull(uploads.importedAt)));
  }
}
