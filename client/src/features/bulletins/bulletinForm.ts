import {
  type BulletinContent,
  type BulletinView,
  type BulletinWarning,
  SaveBulletinRequest,
} from '@stormhour/shared';
import { fieldErrorsFromZod } from '../../lib/fieldErrors';

/** One row of the crop table as edited; `key` keeps React's rows apart while rows move and go. */
export interface CropRowForm {
  key: number;
  crop: string;
  stage: string;
  advice: string;
}

/** The writer's parts of a bulletin, as the editor holds them. */
export interface BulletinForm {
  issueDate: string;
  summary: string;
  crops: CropRowForm[];
  generalAdvice: string;
}

let nextRowKey = 1;
export function newCropRow(crop = '', stage = '', advice = ''): CropRowForm {
  nextRowKey += 1;
  return { key: nextRowKey, crop, stage, advice };
}

export function formFromBulletin(b: Pick<BulletinView, 'content'>): BulletinForm {
  return {
    issueDate: b.content.issueDate,
    summary: b.content.summary,
    crops: b.content.crops.map((c) => newCropRow(c.crop, c.stage, c.advice)),
    generalAdvice: b.content.generalAdvice,
  };
}

/** What the preview shows while the writer types: the stored bulletin with the form's parts in it. */
export function previewContent(content: BulletinContent, form: BulletinForm): BulletinContent {
  return {
    ...content,
    issueDate: form.issueDate,
    summary: form.summary,
    crops: form.crops.map(({ crop, stage, advice }) => ({ crop, stage, advice })),
    generalAdvice: form.generalAdvice,
  };
}

export function sameForm(a: BulletinForm, b: BulletinForm): boolean {
  const strip = (f: BulletinForm) => ({
    ...f,
    crops: f.crops.map(({ crop, stage, advice }) => [crop, stage, advice]),
  });
  return JSON.stringify(strip(a)) === JSON.stringify(strip(b));
}

/**
 * The form as the server's schema checks it, so every refusal is said beside its field before anything is
 * sent: keys are field paths such as "crops.2.advice".
 */
export function checkBulletinForm(
  form: BulletinForm,
  baseVersion: number,
): { ok: true; body: SaveBulletinRequest } | { ok: false; errors: Record<string, string> } {
  const parsed = SaveBulletinRequest.safeParse({
    baseVersion,
    issueDate: form.issueDate,
    summary: form.summary,
    crops: form.crops.map(({ crop, stage, advice }) => ({ crop, stage, advice })),
    generalAdvice: form.generalAdvice,
  });
  return parsed.success
    ? { ok: true, body: parsed.data }
    : { ok: false, errors: fieldErrorsFromZod(parsed.error) };
}

/** The server names a warning's place as "crops[2].advice"; the form's fields are "crops.2.advice". */
export function warningField(where: BulletinWarning['where']): string {
  return where.replace(/\[(\d+)\]/g, '.$1');
}

/** Warnings keyed by the field they concern, the first one per field. */
export function warningsByField(warnings: readonly BulletinWarning[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const w of warnings) out[warningField(w.where)] ??= w.message;
  return out;
}
