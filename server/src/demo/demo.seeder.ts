import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { Inject, Injectable, Logger, type OnApplicationBootstrap } from '@nestjs/common';
import { CreateSiteRequest, type Role, type SessionUser } from '@stormhour/shared';
import { CropCalendarService } from '../advice/crop-calendar.service.js';
import { AuditService } from '../audit/audit.service.js';
import { BulletinsService } from '../bulletins/bulletins.service.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { IntakeService } from '../intake/intake.service.js';
import { SitesService } from '../radar/sites.service.js';
import { RegionsRepository } from '../regions/regions.repository.js';
import { RegionsService } from '../regions/regions.service.js';
import { hashPassword } from '../users/passwords.js';
import { UsersRepository } from '../users/users.repository.js';

export const DEMO_DOMAIN = 'vessary.example';

/**
 * With DEMO=1 and an empty database, loads the invented Vessary Province: its blocks through the
 * normal import, its crop calendars through the calendar import, and one account per role (one officer per district). Never runs twice.
 */
@Injectable()
export class DemoSeeder implements OnApplicationBootstrap {
  private readonly logger = new Logger('Demo');

  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly users: UsersRepository,
    private readonly regions: RegionsService,
    private readonly regionsRepo: RegionsRepository,
    private readonly audit: AuditService,
    private readonly sites: SitesService,
    private readonly intake: IntakeService,
    private readonly calendars: CropCalendarService,
    private readonly bulletins: BulletinsService,
  ) {}

  async onApplicationBootstrap(): Promise<void> {
    if (!this.config.demo || (await this.users.count()) > 0) return;
    const started = Date.now();
    const blocksFile = join(this.config.demoDataDir, 'blocks.geojson');
    if (existsSync(blocksFile)) {
      await this.regions.importBlocks(null, 'blocks.geojson', readFileSync(blocksFile, 'utf8'));
    } else {
      this.logger.warn(`No demo blocks at ${blocksFile}; the demo starts without blocks.`);
    }
    const calendarFile = join(this.config.demoDataDir, 'crop-calendars.csv');
    if (existsSync(calendarFile)) {
      await this.calendars.importCsv(null, 'crop-calendars.csv', readFileSync(calendarFile, 'utf8'));
    }
    const passwordHash = await hashPassword(this.config.demoPassword);
    const accounts: { email: string; name: string; role: Role; districtId: number | null }[] = [
      { email: `admin@${DEMO_DOMAIN}`, name: 'Demo administrator', role: 'admin', districtId: null },
      {
        email: `scientist@${DEMO_DOMAIN}`,
        name: 'Demo agro-met scientist',
        role: 'scientist',
        districtId: null,
      },
      { email: `writer@${DEMO_DOMAIN}`, name: 'Demo advisory writer', role: 'writer', districtId: null },
    ];
    for (const d of await this.regionsRepo.listDistricts()) {
      accounts.push({
        email: `officer.${d.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}@${DEMO_DOMAIN}`,
        name: `Demo extension officer, ${d.name}`,
        role: 'officer',
        districtId: d.id,
      });
    }
    const made = await this.users.transaction(async (tx) => {
      const rows = [];
      for (const a of accounts) rows.push(await this.users.insert({ ...a, passwordHash }, tx));
      await this.audit.record(null, 'demo.seed', null, { accounts: accounts.length }, tx);
      return rows;
    });
    const radar = await this.loadRadar();
    const bulletin = radar ? await this.sendDemoBulletin(made) : '';
    this.logger.log(
      `Demo scenario loaded in ${Date.now() - started} ms: ${accounts.length} demo accounts${radar}${bulletin}.`,
    );
  }

  /**
   * One bulletin through the whole review, sent to Riverbend's officer, for the forecast week after the
   * season (so the Inbox and the Scorecard have something to show). A failure is logged, not fatal.
   */
  private async sendDemoBulletin(
    accounts: { id: number; email: string; name: string; role: Role; districtId: number | null }[],
  ): Promise<string> {
    const as = (role: Role): SessionUser | undefined => {
      const a = accounts.find((x) => x.role === role);
      return a && { id: a.id, email: a.email, name: a.name, role: a.role, districtId: a.districtId };
    };
    const [writer, scientist] = [as('writer'), as('scientist')];
    const district = (await this.regionsRepo.listDistricts()).find((d) => d.code === 'RVB');
    if (!writer || !scientist || !district) return '';
    try {
      const draft = await this.bulletins.create(writer, { districtId: district.id, weekStart: '2025-09-29' });
      await this.bulletins.submit(writer, draft.id);
      await this.bulletins.approve(scientist, draft.id, 'Demo bulletin, approved at first start.');
      const sent = await this.bulletins.send(writer, draft.id);
      return `; bulletin ${sent.number} sent to ${sent.recipientsCount} officer(s)`;
    } catch (e) {
      this.logger.warn(`The demo bulletin was not sent: ${e instanceof Error ? e.message : String(e)}`);
      return '';
    }
  }

  /**
   * The demo site and its season go in through the same intake jobs a scientist uses: the scan
   * inventory first (so onsets are judged against it), then the cell table, then the volume run.
   */
  private async loadRadar(): Promise<string> {
    const dir = this.config.demoDataDir;
    const siteFile = join(dir, 'site.json');
    if (!existsSync(siteFile)) return '';
    // The generator writes the site as the API takes it.
    const siteJson = JSON.parse(readFileSync(siteFile, 'utf8')) as { createSiteRequest: unknown };
    const site = await this.sites.create(null, CreateSiteRequest.parse(siteJson.createSiteRequest));
    const files = readdirSync(dir);
    const runDir = files.find((f) => f.startsWith('run-'));
    const at = (re: RegExp) => files.filter((f) => re.test(f)).map((f) => join(dir, f));
    const steps: [
      kind: 'scan-inventory' | 'cell-table' | 'volume' | 'anomaly-grid',
      paths: string[],
      product?: 'forecast',
    ][] = [
      ['anomaly-grid', at(/^anomalies-.*\.tif$/)],
      // The coming week's forecast grids, kept apart from the analyses (for the Outlook's expected regime).
      ['anomaly-grid', at(/^forecast-.*\.tif$/), 'forecast'],
      ['scan-inventory', at(/^scans-.*\.csv$/)],
      ['cell-table', at(/^cells-.*\.csv$/)],
      [
        'volume',
        runDir
          ? readdirSync(join(dir, runDir))
              .filter((f) => /^volume-.*\.tif$/.test(f))
              .sort()
              .map((f) => join(dir, runDir, f))
          : [],
      ],
    ];
    const summary: string[] = [];
    for (const [kind, paths, product] of steps) {
      if (paths.length === 0) continue;
      const t = Date.now();
      const incoming = paths.map((p) => {
        const buffer = readFileSync(p);
        return { originalname: basename(p), buffer, size: buffer.length };
      });
      const { job, done } = await this.intake.submit(
        null,
        {
          siteId: site.id,
          kind,
          onError: 'skip',
          product: product ?? 'analysis',
          fieldKind: 'anomaly',
        },
        incoming,
      );
      await done;
      summary.push(
        `${product ? `${product} ` : ''}${kind} ${paths.length} file(s) in ${Date.now() - t} ms (job ${job.id})`,
      );
    }
    return summary.length ? `; radar site ${site.code}: ${summary.join(', ')}` : '';
  }
}
