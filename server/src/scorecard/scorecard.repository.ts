import { Inject, Injectable } from '@nestjs/common';
import type { BulletinContent, BulletinOutlookInputs } from '@stormhour/shared';
import { and, asc, eq, gte, inArray, lte } from 'drizzle-orm';
import { DATABASE, type DatabaseHandle } from '../database/database.js';
import { blocks, bulletins, bulletinVersions, districts, fieldReports } from '../database/schema.js';

export interface SentBulletin {
  id: number;
  number: string;
  weekStart: string;
  utcOffsetMinutes: number;
  inputs: BulletinOutlookInputs;
  content: BulletinContent;
}

export interface StoredReport {
  bulletinId: number;
  blockCode: string;
  stormSeen: boolean;
  startLocal: string | null;
  at: Date;
}

/** Reads what the scorecard scores: sent bulletins as frozen at approval, and their field reports. */
@Injectable()
export class ScorecardRepository {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  async district(id: number): Promise<{ id: number; name: string } | undefined> {
    const [row] = await this.handle.db
      .select({ id: districts.id, name: districts.name })
      .from(districts)
      .where(eq(districts.id, id));
    return row;
  }

  /** Sent bulletins of a district whose week starts between the two dates (a week before `from` included). */
  async sentBulletins(districtId: number, weekFrom: string, weekTo: string): Promise<SentBulletin[]> {
    const rows = await this.handle.db
      .select({
        id: bulletins.id,
        number: bulletins.number,
        weekStart: bulletins.weekStart,
        utcOffsetMinutes: bulletins.utcOffsetMinutes,
        draftedFrom: bulletins.draftedFrom,
        approvedFrom: bulletins.approvedFrom,
        content: bulletinVersions.content,
      })
      .from(bulletins)
      .innerJoin(
        bulletinVersions,
        and(
          eq(bulletinVersions.bulletinId, bulletins.id),
          eq(bulletinVersions.version, bulletins.approvedVersion),
        ),
      )
      .where(
        and(
          eq(bulletins.districtId, districtId),
          eq(bulletins.state, 'sent'),
          gte(bulletins.weekStart, weekFrom),
          lte(bulletins.weekStart, weekTo),
        ),
      )
      .orderBy(asc(bulletins.weekStart), asc(bulletins.id));
    return rows.map((r) => ({
      id: r.id,
      number: r.number,
      weekStart: r.weekStart,
      utcOffsetMinutes: r.utcOffsetMinutes,
      inputs: r.approvedFrom ?? r.draftedFrom,
      content: r.content as BulletinContent,
    }));
  }

  async reports(bulletinIds: number[]): Promise<StoredReport[]> {
    if (bulletinIds.length === 0) return [];
    return this.handle.db
      .select({
        bulletinId: fieldReports.bulletinId,
        blockCode: blocks.code,
        stormSeen: fieldReports.stormSeen,
        startLocal: fieldReports.startLocal,
        at: fieldReports.at,
      })
      .from(fieldReports)
      .innerJoin(blocks, eq(blocks.id, fieldReports.blockId))
      .where(inArray(fieldReports.bulletinId, bulletinIds))
      .orderBy(asc(fieldReports.id));
  }
}
