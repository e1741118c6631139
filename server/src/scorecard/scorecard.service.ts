import { BadRequestException, Injectable } from '@nestjs/common';
import {
  HIGH_AFTERNOON_CHANCE,
  OutlookQuery,
  type ScorecardPair,
  type ScorecardQuery,
  type ScorecardView,
  type SourceAgreement,
} from '@stormhour/shared';
import { AdviceRepository } from '../advice/advice.repository.js';
import { OutlookService } from '../outlook/outlook.service.js';
import { dateOfDay, dayOfDate, localDay } from '../radar/engine/local-time.js';
import {
  type IssuedChance,
  pairChances,
  type RadarAfternoon,
  type ReportObservation,
} from './engine/pairing.js';
import { scorePairs } from './engine/scorecard.js';
import { ScorecardRepository, type SentBulletin } from './scorecard.repository.js';

export interface Scorecard {
  view: ScorecardView;
  pairs: ScorecardPair[];
}

/** Bootstrap seed: the same data give the same intervals on every request and in the PDF. */
const SEED = 20_250_601;

/**
 * The scorecard of a district and period (DESIGN §3.8): every sent bulletin's afternoon chances,
 * per block and valid day, paired with radar onsets and field reports, then scored. Only days that
 * have passed and lie in the period are scored; withdrawn bulletins are not (their chances were taken
 * back, and the correction that replaced them is scored instead).
 */
@Injectable()
export class ScorecardService {
  constructor(
    private readonly repo: ScorecardRepository,
    private readonly outlook: OutlookService,
    private readonly advice: AdviceRepository,
  ) {}

  async scorecard(q: ScorecardQuery, now = new Date()): Promise<Scorecard> {
    const district = await this.repo.district(q.districtId);
    if (!district)
      throw new BadRequestException({
        message: `There is no district with id ${q.districtId}.`,
        details: [{ where: 'districtId', problem: 'no such district' }],
      });
    const weekFrom = dateOfDay(dayOfDate(q.from) - 6);
    const sent = await this.repo.sentBulletins(q.districtId, weekFrom, q.to);
    const reports = await this.repo.reports(sent.map((b) => b.id));

    const pairs: ScorecardPair[] = [];
    const agreement: SourceAgreement = { both: 0, radarOnly: 0, reportOnly: 0, neither: 0 };
    let scored = 0;
    for (const group of groupBySiteAndWindow(sent)) {
      const issued = group.bulletins.flatMap((b) => issuedChances(b, q.from, q.to, now));
      if (issued.length === 0) continue;
      scored += new Set(issued.map((c) => c.bulletinId)).size;
      const dates = issued.flatMap((c) => c.dates).sort();
      const radar =
        q.source === 'reports' ? [] : await this.radarAfternoons(group, dates[0], dates[dates.length - 1]);
      const observations: ReportObservation[] = reports
        .filter((r) => group.bulletins.some((b) => b.id === r.bulletinId))
        .map((r) => ({
          bulletinId: r.bulletinId,
          blockCode: r.blockCode,
          stormSeen: r.stormSeen,
          startLocal: r.startLocal,
          filedOn: dateOfDay(localDay(r.at.getTime(), group.utcOffsetMinutes)),
        }));
      const paired = pairChances(issued, radar, observations, group.window, q.source);
      pairs.push(...paired.pairs);
      for (const k of Object.keys(agreement) as (keyof SourceAgreement)[])
        agreement[k] += paired.agreement[k];
    }
    pairs.sort((a, b) => a.date.localeCompare(b.date) || a.blockCode.localeCompare(b.blockCode));
    const scores = scorePairs(pairs, {
      resamples: q.resamples,
      thresholds: await this.adviceThresholds(),
      seed: SEED,
    });
    return {
      view: {
        districtId: district.id,
        districtName: district.name,
        from: q.from,
        to: q.to,
        source: q.source,
        bulletins: scored,
        agreement,
        ...scores,
      },
      pairs,
    };
  }

  /** Radar's afternoons for the group's site and window, counted as the outlook counts them. */
  private async radarAfternoons(group: BulletinGroup, from: string, to: string): Promise<RadarAfternoon[]> {
    const answer = await this.outlook.afternoonDaily({
      ...OutlookQuery.parse({
        siteId: group.siteId,
        afternoonFrom: group.window.fromHour,
        afternoonTo: group.window.toHour,
        binHours: group.binHours,
      }),
      from,
      to,
    });
    const { counted, storm, blockCounted } = answer.daily;
    const days = answer.dates.length;
    const out: RadarAfternoon[] = [];
    answer.blocks.forEach((block, b) => {
      if (!blockCounted[b]) return;
      for (let p = 0; p < days; p++)
        if (counted[p])
          out.push({ blockCode: block.code, date: answer.dates[p], stormStarted: storm[b * days + p] === 1 });
    });
    return out;
  }

  /** "Yes" thresholds: the afternoon chances the advice rules act on, and the bulletins' "high" chance. */
  private async adviceThresholds(): Promise<number[]> {
    const values = new Set<number>([HIGH_AFTERNOON_CHANCE]);
    for (const rule of (await this.advice.listRules()).filter((r) => r.active))
      for (const clause of rule.condition.clauses)
        if (clause.metric === 'afternoonChance' && (clause.op === '>=' || clause.op === '>'))
          values.add(clause.value);
    return [...values].sort((a, b) => a - b);
  }
}

interface BulletinGroup {
  siteId: number;
  window: { fromHour: number; toHour: number };
  binHours: number;
  utcOffsetMinutes: number;
  bulletins: SentBulletin[];
}

/** Bulletins made from the same site with the same afternoon window share one radar count. */
function groupBySiteAndWindow(sent: SentBulletin[]): BulletinGroup[] {
  const groups = new Map<string, BulletinGroup>();
  for (const b of sent) {
    const window = { fromHour: b.content.afternoonFromHour, toHour: b.content.afternoonToHour };
    const key = `${b.inputs.siteId}|${window.fromHour}|${window.toHour}|${b.inputs.binHours}`;
    const group = groups.get(key) ?? {
      siteId: b.inputs.siteId,
      window,
      binHours: b.inputs.binHours,
      utcOffsetMinutes: b.utcOffsetMinutes,
      bulletins: [],
    };
    group.bulletins.push(b);
    groups.set(key, group);
  }
  return [...groups.values()];
}

/** A bulletin's blocks with a chance, valid on its days inside the period that have ended. */
export function issuedChances(b: SentBulletin, from: string, to: string, now: Date): IssuedChance[] {
  const today = dateOfDay(localDay(now.getTime(), b.utcOffsetMinutes));
  const dates: string[] = [];
  for (let d = dayOfDate(b.content.weekStart); d <= dayOfDate(b.content.weekEnd); d++) {
    const date = dateOfDay(d);
    if (date >= from && date <= to && date < today) dates.push(date);
  }
  if (dates.length === 0) return [];
  return b.content.outlook
    .filter((row) => row.afternoonChance !== null)
    .map((row) => ({
      bulletinId: b.id,
      bulletinNumber: b.number,
      blockCode: row.blockCode,
      blockName: row.blockName,
      dates,
      chance: row.afternoonChance as number,
      climatologyChance: row.climatologyChance,
    }));
}
