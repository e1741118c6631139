import type { ScorecardPair, ScorecardSource, SourceAgreement } from '@stormhour/shared';

/** One block's afternoon chance as a sent bulletin gave it, valid on each of `dates`. */
export interface IssuedChance {
  bulletinId: number;
  bulletinNumber: string;
  blockCode: string;
  blockName: string;
  /** Local dates of the bulletin's validity, YYYY-MM-DD. */
  dates: string[];
  chance: number;
  climatologyChance: number | null;
}

/**
 * What radar saw in a block's afternoon window on a day. Only days with enough radar availability,
 * and blocks covered enough, are given: the rest are not scored from radar.
 */
export interface RadarAfternoon {
  blockCode: string;
  date: string;
  stormStarted: boolean;
}

/** An officer's field report on one block of a bulletin. */
export interface ReportObservation {
  bulletinId: number;
  blockCode: string;
  stormSeen: boolean;
  /** Local start time, YYYY-MM-DDTHH:mm; null when no storm was seen. */
  startLocal: string | null;
  /** Local date the report was filed. */
  filedOn: string;
}

export interface AfternoonWindow {
  fromHour: number;
  toHour: number;
}

const key = (blockCode: string, date: string) => `${blockCode}|${date}`;

/**
 * Outcomes from field reports, per (bulletin, block, day). A report of a storm starting in the
 * afternoon window marks that day 1. A report of no storm speaks for the bulletin's days up to the day
 * it was filed, which are 0 unless another report marks them. A storm starting outside the window says
 * nothing about that day's afternoon, so on its own it scores nothing.
 */
export function reportOutcomes(
  issued: readonly IssuedChance[],
  reports: readonly ReportObservation[],
  window: AfternoonWindow,
): Map<string, 0 | 1> {
  const byBulletinBlock = new Map<string, ReportObservation[]>();
  for (const r of reports) {
    const k = `${r.bulletinId}|${r.blockCode}`;
    const list = byBulletinBlock.get(k);
    if (list) list.push(r);
    else byBulletinBlock.set(k, [r]);
  }
  const outcomes = new Map<string, 0 | 1>();
  for (const chance of issued) {
    const filed = byBulletinBlock.get(`${chance.bulletinId}|${chance.blockCode}`);
    if (!filed) continue;
    const days = new Map<string, 0 | 1>();
    for (const r of filed) {
      if (r.stormSeen) continue;
      for (const date of chance.dates) if (date <= r.filedOn && !days.has(date)) days.set(date, 0);
    }
    for (const r of filed) {
      if (!r.stormSeen || !r.startLocal) continue;
      const date = r.startLocal.slice(0, 10);
      const hour = Number(r.startLocal.slice(11, 13));
      if (chance.dates.includes(date) && hour >= window.fromHour && hour < window.toHour) days.set(date, 1);
    }
    for (const [date, o] of days) outcomes.set(`${chance.bulletinId}|${key(chance.blockCode, date)}`, o);
  }
  return outcomes;
}

/**
 * Pairs every issued chance with the outcome of each valid day from the chosen source. With
 * `combined`, radar decides where it has the day and reports fill the rest. When two bulletins cover
 * the same block and day (a correction), both are scored: each was sent.
 */
export function pairChances(
  issued: readonly IssuedChance[],
  radar: readonly RadarAfternoon[],
  reports: readonly ReportObservation[],
  window: AfternoonWindow,
  source: ScorecardSource,
): { pairs: ScorecardPair[]; agreement: SourceAgreement } {
  const radarOutcome = new Map<string, 0 | 1>();
  for (const r of radar) radarOutcome.set(key(r.blockCode, r.date), r.stormStarted ? 1 : 0);
  const reportOutcome = reportOutcomes(issued, reports, window);
  const pairs: ScorecardPair[] = [];
  const agreement: SourceAgreement = { both: 0, radarOnly: 0, reportOnly: 0, neither: 0 };
  const compared = new Set<string>();
  for (const c of issued) {
    for (const date of c.dates) {
      const fromRadar = radarOutcome.get(key(c.blockCode, date));
      const fromReport = reportOutcome.get(`${c.bulletinId}|${key(c.blockCode, date)}`);
      const blockDay = key(c.blockCode, date);
      if (fromRadar !== undefined && fromReport !== undefined && !compared.has(blockDay)) {
        compared.add(blockDay);
        if (fromRadar && fromReport) agreement.both++;
        else if (fromRadar) agreement.radarOnly++;
        else if (fromReport) agreement.reportOnly++;
        else agreement.neither++;
      }
      const [observed, from] =
        source === 'radar'
          ? [fromRadar, 'radar' as const]
          : source === 'reports'
            ? [fromReport, 'report' as const]
            : fromRadar !== undefined
              ? [fromRadar, 'radar' as const]
              : [fromReport, 'report' as const];
      if (observed === undefined) continue;
      pairs.push({
        bulletinId: c.bulletinId,
        bulletinNumber: c.bulletinNumber,
        blockCode: c.blockCode,
        blockName: c.blockName,
        date,
        chance: c.chance,
        climatologyChance: c.climatologyChance,
        observed,
        source: from,
      });
    }
  }
  return { pairs, agreement };
}
