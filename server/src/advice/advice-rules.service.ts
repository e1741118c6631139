import { Injectable, Logger, NotFoundException, type OnApplicationBootstrap } from '@nestjs/common';
import type { AdviceRuleRequest, AdviceRuleView, SessionUser } from '@stormhour/shared';
import { AuditService } from '../audit/audit.service.js';
import { AdviceRepository } from './advice.repository.js';
import { DEFAULT_ADVICE_RULES } from './default-rules.js';

@Injectable()
export class AdviceRulesService implements OnApplicationBootstrap {
  private readonly logger = new Logger('Advice');

  constructor(
    private readonly repo: AdviceRepository,
    private readonly audit: AuditService,
  ) {}

  /**
   * An empty rules table gets the shipped defaults. Rules are never deleted, only retired, so the
   * table is empty only before the first start.
   */
  async onApplicationBootstrap(): Promise<void> {
    if ((await this.repo.ruleCount()) > 0) return;
    await this.repo.transaction(async (tx) => {
      for (const rule of DEFAULT_ADVICE_RULES) await this.repo.insertRule(rule, 'default', null, tx);
      await this.audit.record(null, 'advice-rules.seed', null, { rules: DEFAULT_ADVICE_RULES.length }, tx);
    });
    this.logger.log(`Loaded ${DEFAULT_ADVICE_RULES.length} default advice rules.`);
  }

  list(): Promise<AdviceRuleView[]> {
    return this.repo.listRules();
  }

  async create(actor: SessionUser, req: AdviceRuleRequest): Promise<AdviceRuleView> {
    const id = await this.repo.transaction(async (tx) => {
      const created = await this.repo.insertRule(req, 'unit', actor.id, tx);
      await this.audit.record(actor, 'advice-rule.create', `advice-rule:${created}`, { ...req }, tx);
      return created;
    });
    return this.find(id);
  }

  async update(actor: SessionUser, id: number, req: AdviceRuleRequest): Promise<AdviceRuleView> {
    if (!(await this.repo.ruleExists(id)))
      throw new NotFoundException(`There is no advice rule with id ${id}.`);
    await this.repo.transaction(async (tx) => {
      await this.repo.updateRule(id, req, actor.id, tx);
      await this.audit.record(actor, 'advice-rule.update', `advice-rule:${id}`, { ...req }, tx);
    });
    return this.find(id);
  }

  private async find(id: number): Promise<AdviceRuleView> {
    return (await this.repo.listRules()).find((r) => r.id === id) as AdviceRuleView;
  }
}
