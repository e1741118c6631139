import { Inject, Injectable } from '@nestjs/common';
import type { SiteSettings, SiteView } from '@stormhour/shared';
import { and, asc, desc, eq } from 'drizzle-orm';
import { DATABASE, type DatabaseHandle, type Executor } from '../database/database.js';
import { radarSites, siteSettings } from '../database/schema.js';

export type SiteRow = typeof radarSites.$inferSelect;
export type NewSiteRow = typeof radarSites.$inferInsert;

@Injectable()
export class SitesRepository {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  async list(): Promise<SiteView[]> {
    const rows = await this.handle.db.select().from(radarSites).orderBy(asc(radarSites.code));
    return Promise.all(rows.map((r) => this.withSettings(r)));
  }

  async find(id: number, executor: Executor = this.handle.db): Promise<SiteView | undefined> {
    const [row] = await executor.select().from(radarSites).where(eq(radarSites.id, id));
    return row && this.withSettings(row, executor);
  }

  async findByCode(code: string): Promise<SiteRow | undefined> {
    const [row] = await this.handle.db.select().from(radarSites).where(eq(radarSites.code, code));
    return row;
  }

  async insert(row: NewSiteRow, executor: Executor): Promise<SiteRow> {
    const [created] = await executor.insert(radarSites).values(row).returning();
    return created;
  }

  async update(id: number, changes: Partial<NewSiteRow>, executor: Executor): Promise<void> {
    await executor.update(radarSites).set(changes).where(eq(radarSites.id, id));
  }

  async addSettingsVersion(
    siteId: number,
    version: number,
    settings: SiteSettings,
    createdBy: number | null,
    executor: Executor,
  ): Promise<void> {
    await executor.insert(siteSettings).values({ siteId, version, settings, createdBy });
  }

  async settingsVersion(siteId: number, version: number): Promise<SiteSettings | undefined> {
    const [row] = await this.handle.db
      .select()
      .from(siteSettings)
      .where(and(eq(siteSettings.siteId, siteId), eq(siteSettings.version, version)));
    return row?.settings;
  }

  async settingsHistory(siteId: number) {
    const rows = await this.handle.db
      .select()
      .from(siteSettings)
      .where(eq(siteSettings.siteId, siteId))
      .orderBy(desc(siteSettings.version));
    return rows.map((r) => ({
      version: r.version,
      settings: r.settings,
      createdAt: r.createdAt.toISOString(),
      createdBy: r.createdBy,
    }));
  }

  transaction<T>(work: (tx: Executor) => Promise<T>): Promise<T> {
    return this.handle.db.transaction(work);
  }

  private async withSettings(row: SiteRow, executor: Executor = this.handle.db): Promise<SiteView> {
    const [latest] = await executor
      .select()
      .from(siteSettings)
      .where(eq(siteSettings.siteId, row.id))
      .orderBy(desc(siteSettings.version))
      .limit(1);
    const { createdAt: _c, ...site } = row;
    return { ...site, settingsVersion: latest.version, settings: latest.settings };
  }
}
