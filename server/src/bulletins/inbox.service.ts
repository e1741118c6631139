import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import {
  addDays,
  type FieldReportRequest,
  type FieldReportView,
  type InboxBulletinView,
  type InboxItem,
  type SessionUser,
} from '@stormhour/shared';
import { AuditService } from '../audit/audit.service.js';
import { BulletinsRepository, type BulletinWithNames, type FieldReportRow } from './bulletins.repository.js';
import { localToUtc, weekBounds } from './engine/local-week.js';

const RECEIVED = ['sent', 'withdrawn'] as const;

/**
 * The extension officer's side: the district's sent bulletins (withdrawn ones stay, marked), reading and
 * acknowledging them, and field reports of what was seen in each block.
 */
@Injectable()
export class InboxService {
  constructor(
    private readonly repo: BulletinsRepository,
    private readonly audit: AuditService,
  ) {}

  async list(officer: SessionUser): Promise<InboxItem[]> {
    if (officer.districtId === null) return [];
    const rows = (await this.repo.list({ districtId: officer.districtId, states: [...RECEIVED] })).sort(
      (a, b) => (b.sentAt?.getTime() ?? 0) - (a.sentAt?.getTime() ?? 0) || b.id - a.id,
    );
    const ids = rows.map((r) => r.id);
    const [reads, counts] = await Promise.all([
      this.repo.readsOf(officer.id, ids),
      this.repo.reportCounts(officer.id, ids),
    ]);
    const readOf = new Map(reads.map((r) => [r.bulletinId, r]));
    const items: InboxItem[] = [];
    for (const b of rows) {
      const content = (await this.repo.version(b.id, b.approvedVersion as number)).content;
      items.push(this.item(b, readOf.get(b.id), counts.get(b.id) ?? 0, highest(content.outlook)));
    }
    return items;
  }

  private item(
    b: BulletinWithNames,
    read: { readAt: Date; acknowledgedAt: Date | null } | undefined,
    reportCount: number,
    highestChance: number | null,
  ): InboxItem {
    return {
      id: b.id,
      number: b.number,
      districtName: b.districtName,
      weekStart: b.weekStart,
      weekEnd: addDays(b.weekStart, 6),
      state: b.state as InboxItem['state'],
      sentAt: (b.sentAt as Date).toISOString(),
      withdrawnAt: b.withdrawnAt?.toISOString() ?? null,
      withdrawalReason: b.withdrawalReason,
      readAt: read?.readAt.toISOString() ?? null,
      acknowledgedAt: read?.acknowledgedAt?.toISOString() ?? null,
      unread: read === undefined,
      highestChance,
      reportCount,
    };
  }

  /** A bulletin of the officer's own district that has been sent; anything else is "not found". */
  private async received(officer: SessionUser, id: number): Promise<BulletinWithNames> {
    const b = await this.repo.find(id);
    if (!b || b.districtId !== officer.districtId || !(RECEIVED as readonly string[]).includes(b.state))
      throw new NotFoundException(`Your inbox has no bulletin ${id}.`);
    return b;
  }

  /** Opens a bulletin: the first opening is recorded as its read time. */
  async open(officer: SessionUser, id: number): Promise<InboxBulletinView> {
    const b = await this.received(officer, id);
    await this.repo.transaction((tx) => this.repo.markRead(id, officer.id, false, tx));
    return this.view(officer, b);
  }

  async acknowledge(officer: SessionUser, id: number): Promise<InboxBulletinView> {
    const b = await this.received(officer, id);
    await this.repo.transaction(async (tx) => {
      await this.repo.markRead(id, officer.id, true, tx);
      await this.audit.record(officer, 'bulletin.acknowledge', `bulletin:${id}`, { number: b.number }, tx);
    });
    return this.view(officer, b);
  }

  private async view(officer: SessionUser, b: BulletinWithNames): Promise<InboxBulletinView> {
    const [content, reads, counts, blocks] = await Promise.all([
      this.repo.version(b.id, b.approvedVersion as number).then((v) => v.content),
      this.repo.readsOf(officer.id, [b.id]),
      this.repo.reportCounts(officer.id, [b.id]),
      this.repo.blocksOf(b.districtId),
    ]);
    return {
      ...this.item(b, reads[0], counts.get(b.id) ?? 0, highest(content.outlook)),
      content,
      blocks: blocks.map(({ code, name }) => ({ code, name })),
    };
  }

  async addReport(officer: SessionUser, id: number, req: FieldReportRequest): Promise<FieldReportView> {
    const b = await this.received(officer, id);
    const blocks = await this.repo.blocksOf(b.districtId);
    const block = blocks.find((x) => x.code === req.blockCode);
    const problems: { where: string; problem: string }[] = [];
    if (!block)
      problems.push({
        where: 'blockCode',
        problem: `${req.blockCode} is not a block of ${b.districtName}; choose one of ${blocks.map((x) => x.code).join(', ')}`,
      });
    let start: Date | null = null;
    if (req.stormSeen && req.startTime) {
      start = localToUtc(req.startTime, b.utcOffsetMinutes);
      const week = weekBounds(b.weekStart, b.utcOffsetMinutes);
      if (!start)
        problems.push({ where: 'startTime', problem: `${req.startTime} is not a real date and time` });
      else if (start < week.from || start >= week.to)
        problems.push({
          where: 'startTime',
          problem: `${req.startTime} is outside the bulletin's week, ${b.weekStart} 00:00 to ${addDays(b.weekStart, 6)} 23:59 local time`,
        });
    }
    if (problems.length)
      throw new BadRequestException({
        message: `The field report was not saved: ${problems.map((p) => `${p.where}: ${p.problem}`).join('; ')}.`,
        details: problems,
      });
    const reportId = await this.repo.transaction(async (tx) => {
      const created = await this.repo.insertReport(
        {
          bulletinId: id,
          blockId: (block as { id: number }).id,
          officerId: officer.id,
          stormSeen: req.stormSeen,
          startLocal: req.stormSeen ? (req.startTime ?? null) : null,
          startTime: req.stormSeen ? start : null,
          hail: req.hail,
          windDamage: req.windDamage,
          cropDamage: req.cropDamage,
          actionTaken: req.actionTaken,
          usefulness: req.usefulness,
          notes: req.notes,
        },
        tx,
      );
      await this.audit.record(
        officer,
        'bulletin.field-report',
        `bulletin:${id}`,
        { report: created, block: req.blockCode, stormSeen: req.stormSeen },
        tx,
      );
      return created;
    });
    const rows = await this.repo.reports({ bulletinId: id, officerId: officer.id });
    return reportView(rows.find((r) => r.id === reportId) as FieldReportRow);
  }

  async reports(officer: SessionUser, id: number): Promise<FieldReportView[]> {
    await this.received(officer, id);
    return (await this.repo.reports({ bulletinId: id, officerId: officer.id })).map(reportView);
  }

  /** Every officer's reports on a bulletin (for the scientist and the scorecard). */
  async allReports(id: number): Promise<FieldReportView[]> {
    if (!(await this.repo.find(id))) throw new NotFoundException(`There is no bulletin with id ${id}.`);
    return (await this.repo.reports({ bulletinId: id })).map(reportView);
  }
}

function highest(outlook: { afternoonChance: number | null }[]): number | null {
  const values = outlook.map((b) => b.afternoonChance).filter((p): p is number => p !== null);
  return values.length ? values.reduce((m, p) => Math.max(m, p), 0) : null;
}

function reportView(r: FieldReportRow): FieldReportView {
  return {
    id: r.id,
    bulletinId: r.bulletinId,
    blockCode: r.blockCode,
    blockName: r.blockName,
    officerEmail: r.officerEmail,
    stormSeen: r.stormSeen,
    startTime: r.startLocal,
    startTimeUtc: r.startTime?.toISOString() ?? null,
    hail: r.hail,
    windDamage: r.windDamage,
    cropDamage: r.cropDamage,
    actionTaken: r.actionTaken,
    usefulness: r.usefulness,
    notes: r.notes,
    at: r.at.toISOString(),
  };
}
