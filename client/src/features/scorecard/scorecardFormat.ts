import type {
  BulletinSummaryView,
  ReliabilityRow,
  ScorecardView,
  ScoreInterval,
  SourceAgreement,
} from '@stormhour/shared';

/** A score as staff read it: three decimals and a true minus sign; "–" when there is none. */
export function formatNumber(value: number | null, digits = 3): string {
  if (value === null || !Number.isFinite(value)) return '–';
  const text = Math.abs(value).toFixed(digits);
  // A value that rounds to zero is not negative.
  return value < 0 && Number(text) !== 0 ? `\u2212${text}` : text;
}

/** "0.182 (90 % interval 0.160–0.205)", or just "0.182" when no interval was resampled. */
export function formatScore(value: number | null, interval: ScoreInterval | null, digits = 3): string {
  if (value === null) return '–';
  if (!interval) return formatNumber(value, digits);
  return `${formatNumber(value, digits)} (90 % interval ${formatNumber(interval.lower, digits)}–${formatNumber(interval.upper, digits)})`;
}

export function percent(value: number | null, digits = 0): string {
  return value === null || !Number.isFinite(value) ? '–' : `${(value * 100).toFixed(digits)} %`;
}

/** A reliability bin's issued-chance range, "20–30 %". */
export function binLabel(row: Pick<ReliabilityRow, 'lower' | 'upper'>): string {
  return `${Math.round(row.lower * 100)}–${Math.round(row.upper * 100)} %`;
}

/** One line per score for staff who are not statisticians. */
export const SCORE_EXPLANATIONS = {
  brier:
    'The average squared gap between the chance issued and what happened (1 for a storm, 0 for none). 0 is perfect; saying 50 % every day scores 0.25.',
  climatologyBrier:
    'The same score for the usual (all-days) chance printed beside each block: what the bulletins have to beat.',
  skill:
    'How much better than the usual chance: above 0 the bulletins beat each block’s usual chance, 0 is no better, below 0 is worse; 1 is perfect.',
  rocArea:
    'How well the chances tell storm afternoons from quiet ones: 1 is perfect, 0.5 is no better than tossing a coin.',
  hitRate: 'Of the afternoons with a storm, the share given at least this chance.',
  falseAlarmRatio: 'Of the afternoons given at least this chance, the share with no storm.',
  reliability:
    'How far the chances issued sit from how often storms then came, on average. 0 is perfect; smaller is better.',
  resolution:
    'How much how often storms came differs between the chances issued. Bigger is better: the chances sort storm days from quiet ones.',
  uncertainty:
    'How hard the season was to forecast: it depends only on how often storms came (largest, 0.25, when half the afternoons had one).',
  withinBin:
    'What the three terms leave out when several chances share a bin; zero when each chance issued is its own bin.',
} as const;

/** A plain verdict on the skill, read from its interval where there is one. */
export function skillVerdict(
  skill: number | null,
  interval: ScoreInterval | null,
  sameAsUsual = false,
): string {
  if (skill === null) return 'No skill: the bulletins had no usual chances to compare with.';
  // A bulletin drafted from the all-days outlook issues the usual chances themselves.
  if (sameAsUsual) return 'The bulletins gave each block its usual chance, so there was nothing to beat.';
  if (interval) {
    if (interval.lower > 0) return 'Better than the usual chance, beyond what chance sampling explains.';
    if (interval.upper < 0) return 'Worse than the usual chance, beyond what chance sampling explains.';
    return 'Not clearly better or worse than the usual chance: the interval includes 0.';
  }
  if (skill > 0) return 'Better than the usual chance (no interval was resampled).';
  if (skill < 0) return 'Worse than the usual chance (no interval was resampled).';
  return 'No better than the usual chance.';
}

export interface RocCurvePoint {
  falseAlarmRate: number;
  hitRate: number;
  /** "Yes" at an issued chance of at least this; null for the two ends. */
  threshold: number | null;
}

/**
 * The ROC curve to draw: from (0, 0), the listed points from the highest chance down, then (1, 1).
 * Sorted here so the drawing does not depend on the order the points arrive in.
 */
export function rocCurve(points: ScorecardView['roc']['points']): RocCurvePoint[] {
  const listed = [...points]
    .sort((a, b) => b.threshold - a.threshold)
    .map((p) => ({ falseAlarmRate: p.falseAlarmRate, hitRate: p.hitRate, threshold: p.threshold }));
  const curve: RocCurvePoint[] = [{ falseAlarmRate: 0, hitRate: 0, threshold: null }, ...listed];
  const last = curve[curve.length - 1];
  if (last.falseAlarmRate !== 1 || last.hitRate !== 1)
    curve.push({ falseAlarmRate: 1, hitRate: 1, threshold: null });
  return curve;
}

export interface AgreementSummary {
  total: number;
  agreeing: number;
  /** Share of block-days where radar and reports agree; null with none. */
  share: number | null;
  /** Cohen's kappa: agreement beyond what the two sources' own rates would give by chance. */
  kappa: number | null;
}

/** Agreement of radar and field reports on the block-days both cover. */
export function agreementSummary(a: SourceAgreement): AgreementSummary {
  const total = a.both + a.radarOnly + a.reportOnly + a.neither;
  const agreeing = a.both + a.neither;
  if (total === 0) return { total, agreeing, share: null, kappa: null };
  const observed = agreeing / total;
  const radarYes = (a.both + a.radarOnly) / total;
  const reportYes = (a.both + a.reportOnly) / total;
  const expected = radarYes * reportYes + (1 - radarYes) * (1 - reportYes);
  return {
    total,
    agreeing,
    share: observed,
    kappa: expected < 1 ? (observed - expected) / (1 - expected) : null,
  };
}

export interface MurphyTerm {
  key: 'reliability' | 'resolution' | 'uncertainty' | 'withinBin';
  name: string;
  /** How the term enters the Brier score. */
  sign: 1 | -1;
  value: number;
}

/** The decomposition's terms in the order of BS = REL − RES + UNC (+ the within-bin rest), and their sum, the Brier score. */
export function murphyTerms(murphy: NonNullable<ScorecardView['murphy']>): {
  terms: MurphyTerm[];
  sum: number;
} {
  const terms: MurphyTerm[] = [
    { key: 'reliability', name: 'Reliability', sign: 1, value: murphy.reliability },
    { key: 'resolution', name: 'Resolution', sign: -1, value: murphy.resolution },
    { key: 'uncertainty', name: 'Uncertainty', sign: 1, value: murphy.uncertainty },
  ];
  // Shown only when binning leaves something out: chances issued as a few set values leave nothing.
  if (Math.abs(murphy.withinBin) >= 5e-4)
    terms.push({ key: 'withinBin', name: 'Within bins', sign: 1, value: murphy.withinBin });
  // The sum always includes the within-bin rest, so it equals the Brier score whether or not it is listed.
  const sum = murphy.reliability - murphy.resolution + murphy.uncertainty + murphy.withinBin;
  return { terms, sum };
}

const addDays = (date: string, days: number) =>
  new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);

/**
 * The season to propose: from the first sent bulletin's Monday to the last one's Sunday, stopping at
 * yesterday (a day is scored once it has passed). Null without sent bulletins.
 */
export function proposedSeason(
  sent: Pick<BulletinSummaryView, 'weekStart' | 'weekEnd'>[],
  today: string,
): { from: string; to: string } | null {
  if (sent.length === 0) return null;
  // ISO dates sort as text.
  const from = sent.map((b) => b.weekStart).sort()[0];
  const last = sent.map((b) => b.weekEnd).sort()[sent.length - 1];
  const to = [last, addDays(today, -1)].sort()[0];
  return { from, to: [to, from].sort()[1] };
}

/** "scorecard-riverbend-2025-06-02-to-2025-09-28.csv" */
export function scorecardFileName(
  view: Pick<ScorecardView, 'districtName' | 'from' | 'to' | 'source'>,
  extension: 'csv' | 'pdf',
): string {
  const district = view.districtName
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '');
  return `scorecard-${district}-${view.from}-to-${view.to}-${view.source}.${extension}`;
}
