import {
  type AdviceBlock,
  type AdviceContext,
  type AdviceProposal,
  addDays,
  BULLETIN_CAUTIONS,
  type BulletinBlockOutlook,
  type BulletinContent,
  chanceWithClimatology,
  formatPercent,
  isoWeek,
  listInWords,
  type OutlookBlock,
  type ProposedAdvice,
  parseDay,
  weekInWords,
} from '@stormhour/shared';

/**
 * A bulletin's first draft from the week's block outlook and the advice the rules propose. Plain
 * functions: the service gathers the inputs (outlook, calendar, rules) and stores what comes out.
 */

const WEEKDAYS = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'];

/** Why a date cannot start a bulletin week, or null: bulletins run over ISO weeks, Monday to Sunday. */
export function weekStartProblem(weekStart: string): string | null {
  const day = parseDay(weekStart);
  if (!day) return `${weekStart} is not a calendar date`;
  const weekday = day.getUTCDay();
  if (weekday === 1) return null;
  const monday = addDays(weekStart, weekday === 0 ? -6 : 1 - weekday);
  return `${weekStart} is a ${WEEKDAYS[weekday]}; bulletins run over ISO weeks from Monday to Sunday: use ${monday}`;
}

/** "RVB-2025-40": district code, ISO week-numbering year and week; "-R1" … for a reissue after withdrawal. */
export function bulletinNumber(districtCode: string, weekStart: string, reissue = 0): string {
  const { year, week } = isoWeek(weekStart);
  const base = `${districtCode}-${year}-${String(week).padStart(2, '0')}`;
  return reissue > 0 ? `${base}-R${reissue}` : base;
}

/** The bin of a block's peak, as the local hour it starts. */
export function peakHour(block: OutlookBlock, binHours: number): number | null {
  return block.peakBin === null ? null : block.peakBin * binHours;
}

/** One row of the bulletin's table: the outlook's own numbers, unchanged, with the chance in words. */
export function bulletinRow(block: OutlookBlock, binHours: number): BulletinBlockOutlook {
  const rate = block.hasData ? block.afternoon.rate : null;
  return {
    blockCode: block.code,
    blockName: block.name,
    afternoonChance: rate,
    lower: block.hasData ? block.afternoon.lower : null,
    upper: block.hasData ? block.afternoon.upper : null,
    n: block.afternoon.n ?? 0,
    peakHourLocal: block.hasData ? peakHour(block, binHours) : null,
    climatologyChance: block.hasData ? block.climatologyRate : null,
    inWords:
      rate === null
        ? 'no radar data'
        : chanceWithClimatology(rate, block.hasData ? block.climatologyRate : null),
  };
}

/** What the rules see of a district's week (the same context the rule editor's preview builds). */
export function adviceContext(input: {
  district: { id: number; name: string };
  weekStart: string;
  regime: string | null;
  binHours: number;
  rows: BulletinBlockOutlook[];
  crops: { crop: string; stage: string }[];
}): AdviceContext {
  const blocks: AdviceBlock[] = input.rows.map((r) => ({
    code: r.blockCode,
    name: r.blockName,
    afternoonChance: r.afternoonChance,
    lower: r.lower,
    upper: r.upper,
    n: r.n,
    peakHourLocal: r.peakHourLocal,
    climatologyChance: r.climatologyChance,
  }));
  return {
    district: input.district,
    weekStart: input.weekStart,
    regime: input.regime,
    binHours: input.binHours,
    blocks,
    crops: input.crops,
  };
}

/** Several proposals as one Markdown list (or one paragraph), highest priority first. */
export function adviceText(proposals: ProposedAdvice[], none: string): string {
  if (proposals.length === 0) return none;
  if (proposals.length === 1) return proposals[0].text;
  return proposals.map((p) => `- ${p.text}`).join('\n');
}

/** One or two sentences over the table: where the chance is highest and how it compares with usual. */
export function draftSummary(rows: BulletinBlockOutlook[], regime: string | null, week: string): string {
  const withData = rows.filter((r) => r.afternoonChance !== null);
  if (withData.length === 0)
    return `No radar record covers this district's blocks, so no storm chances can be given for ${week}. Follow the national weather service's forecasts and warnings.`;
  const sorted = [...withData].sort((a, b) => (b.afternoonChance ?? 0) - (a.afternoonChance ?? 0));
  const top = sorted[0];
  const topValue = top.afternoonChance as number;
  const tops = sorted.filter((r) => formatPercent(r.afternoonChance as number) === formatPercent(topValue));
  const low = sorted[sorted.length - 1].afternoonChance as number;
  const condition = regime
    ? `On days like those expected (${regime}), the`
    : 'Over all days of the record, the';
  const range =
    low === topValue
      ? formatPercent(topValue)
      : `${formatPercent(low).replace(' %', '')}–${formatPercent(topValue)}`;
  return (
    `${condition} chance of an afternoon storm for ${week} is ${range} across the district's blocks, ` +
    `highest in ${listInWords(tops.map((r) => r.blockName))}: ${top.inWords}.`
  );
}

export interface DraftInput {
  unitName: string;
  district: { id: number; code: string; name: string };
  weekStart: string;
  issueDate: string;
  number: string;
  regime: string | null;
  binHours: number;
  afternoon: { fromHour: number; toHour: number };
  rows: BulletinBlockOutlook[];
  proposal: AdviceProposal;
}

export function draftContent(input: DraftInput): BulletinContent {
  return {
    unitName: input.unitName,
    districtCode: input.district.code,
    districtName: input.district.name,
    number: input.number,
    issueDate: input.issueDate,
    weekStart: input.weekStart,
    weekEnd: addDays(input.weekStart, 6),
    afternoonFromHour: input.afternoon.fromHour,
    afternoonToHour: input.afternoon.toHour,
    regimeLabel: input.regime,
    summary: draftSummary(input.rows, input.regime, weekInWords(input.weekStart)),
    outlook: input.rows,
    crops: input.proposal.crops.map((c) => ({
      crop: c.crop,
      stage: c.stage,
      advice: adviceText(c.advice, 'No specific advice this week.'),
    })),
    generalAdvice: adviceText(input.proposal.general, 'No general advice this week.'),
    cautions: [...BULLETIN_CAUTIONS],
  };
}
