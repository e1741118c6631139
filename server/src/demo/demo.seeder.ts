import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { Inject, Injectable, Logger, type OnApplicationBootstrap } from '@nestjs/common';
import type { Role } from '@stormhour/shared';
import { AuditService } from '../audit/audit.service.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { RegionsRepository } from '../regions/regions.repository.js';
import { RegionsService } from '../regions/regions.service.js';
import { hashPassword } from '../users/passwords.js';
import { UsersRepository } from '../users/users.repository.js';

export const DEMO_DOMAIN = 'vessary.example';

/**
 * With DEMO=1 and an empty database, loads the invented Vessary Province: its blocks through the
 * normal import, and one account per role (one officer per district). Never runs twice.
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
    await this.users.transaction(async (tx) => {
      for (const a of accounts) await this.users.insert({ ...a, passwordHash }, tx);
      await this.audit.record(null, 'demo.seed', null, { accounts: accounts.length }, tx);
    });
    this.logger.log(`Demo scenario loaded in ${Date.now() - started} ms: ${accounts.length} demo accounts.`);
  }
}
