import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import {
  type CreateSiteRequest,
  type SessionUser,
  SiteSettings,
  type SiteView,
  type UpdateSiteRequest,
} from '@stormhour/shared';
import { AuditService } from '../audit/audit.service.js';
import { coveragePolygon } from './engine/coverage.js';
import { SitesRepository } from './sites.repository.js';

@Injectable()
export class SitesService {
  constructor(
    private readonly sites: SitesRepository,
    private readonly audit: AuditService,
  ) {}

  list(): Promise<SiteView[]> {
    return this.sites.list();
  }

  async get(id: number): Promise<SiteView> {
    const site = await this.sites.find(id);
    if (!site) throw new NotFoundException(`There is no radar site with id ${id}.`);
    return site;
  }

  async create(actor: SessionUser | null, req: CreateSiteRequest): Promise<SiteView> {
    if (await this.sites.findByCode(req.code)) {
      throw new ConflictException({
        message: `A radar site with the code ${req.code} already exists.`,
        details: [{ where: 'code', problem: 'already in use' }],
      });
    }
    const { settings, ...fields } = req;
    return this.sites.transaction(async (tx) => {
      const row = await this.sites.insert(fields, tx);
      await this.sites.addSettingsVersion(row.id, 1, settings, actor?.id ?? null, tx);
      await this.audit.record(
        actor,
        'radar-site.create',
        `radar-site:${row.code}`,
        { settingsVersion: 1 },
        tx,
      );
      return (await this.sites.find(row.id, tx)) as SiteView;
    });
  }

  /** Site fields change in place; any settings change is stored as the next version. */
  async update(actor: SessionUser, id: number, req: UpdateSiteRequest): Promise<SiteView> {
    const current = await this.get(id);
    const { settings: changes, ...fields } = req;
    const merged = changes ? SiteSettings.parse({ ...current.settings, ...changes }) : current.settings;
    // Compare key by key: the stored copy comes back from jsonb with its keys reordered.
    const settingsChanged = (Object.keys(merged) as (keyof SiteSettings)[]).some(
      (k) => JSON.stringify(merged[k]) !== JSON.stringify(current.settings[k]),
    );
    return this.sites.transaction(async (tx) => {
      if (Object.keys(fields).length) await this.sites.update(id, fields, tx);
      const version = settingsChanged ? current.settingsVersion + 1 : current.settingsVersion;
      if (settingsChanged) await this.sites.addSettingsVersion(id, version, merged, actor.id, tx);
      await this.audit.record(
        actor,
        'radar-site.update',
        `radar-site:${current.code}`,
        { ...fields, settingsVersion: version },
        tx,
      );
      return (await this.sites.find(id, tx)) as SiteView;
    });
  }

  async coverage(id: number) {
    const site = await this.get(id);
    return {
      type: 'Feature' as const,
      properties: { siteId: site.id, code: site.code, rangeKm: site.rangeKm },
      geometry: coveragePolygon(site),
    };
  }

  async settingsHistory(id: number) {
    await this.get(id);
    return this.sites.settingsHistory(id);
  }
}
