/**
 * What a district bulletin says, frozen when it is approved (DESIGN §3.7). Free text fields use a small
 * Markdown subset (paragraphs, bullet and numbered lists, *emphasis*, **strong**); raw HTML is shown as
 * text, never interpreted.
 */
export interface BulletinBlockOutlook {
  blockCode: string;
  blockName: string;
  /** Chance of at least one storm starting in the afternoon window on a day of the week, 0–1; null = no data. */
  afternoonChance: number | null;
  /** The 90 % interval of that chance. */
  lower: number | null;
  upper: number | null;
  /** Days the figure rests on. */
  n: number;
  /** Local hour at which the peak time-of-day bin starts. */
  peakHourLocal: number | null;
  /** The same block's chance over all days, for comparison. */
  climatologyChance: number | null;
  /** The chance in plain words, e.g. "about 1 afternoon in 2 (usually 1 in 4)". */
  inWords: string;
}

export interface BulletinCropAdvice {
  crop: string;
  stage: string;
  advice: string;
}

export interface BulletinContent {
  unitName: string;
  districtCode: string;
  districtName: string;
  /** e.g. "RB-2025-27": district code, year and ISO week. */
  number: string;
  /** Local dates, YYYY-MM-DD. */
  issueDate: string;
  weekStart: string;
  weekEnd: string;
  /** Local time of the afternoon window, e.g. 12 and 18. */
  afternoonFromHour: number;
  afternoonToHour: number;
  /** The large-scale regime the week's chances are conditioned on; null for all days. */
  regimeLabel: string | null;
  summary: string;
  outlook: BulletinBlockOutlook[];
  crops: BulletinCropAdvice[];
  generalAdvice: string;
  cautions: string[];
}

/** Printed on every bulletin, in every form it takes. */
export const BULLETIN_CAUTIONS: readonly string[] = [
  'These chances are statistical guidance from past radar and reanalysis data. They are not an official weather warning: always follow the national weather service and local authorities.',
  'Follow the label of every pesticide and fertiliser, including its rain-free period, and licensed local advice.',
  'Lightning can strike well away from the storm. When thunder is heard, go to a building or a closed vehicle and stay there until 30 minutes after the last thunder. Do not start field work that cannot be stopped quickly.',
];
