import { type FieldReportInput, FieldReportRequest } from '@stormhour/shared';
import { fieldErrorsFromZod } from '../../lib/fieldErrors';

/** The field report as the form holds it: every answer as typed, nothing assumed. */
export interface ReportForm {
  blockCode: string;
  stormSeen: '' | 'yes' | 'no';
  startTime: string;
  hail: boolean;
  windDamage: boolean;
  cropDamage: boolean;
  actionTaken: string;
  usefulness: string;
  notes: string;
}

export function emptyReportForm(blockCode = ''): ReportForm {
  return {
    blockCode,
    stormSeen: '',
    startTime: '',
    hail: false,
    windDamage: false,
    cropDamage: false,
    actionTaken: '',
    usefulness: '',
    notes: '',
  };
}

/**
 * Checks the answers with the server's own schema, so each problem is said beside its field before
 * anything is sent. A datetime-local input may add seconds; the report keeps minutes.
 */
export function checkReportForm(
  form: ReportForm,
): { ok: true; body: FieldReportRequest } | { ok: false; errors: Record<string, string> } {
  const input: Record<string, unknown> = {
    blockCode: form.blockCode,
    stormSeen: form.stormSeen === '' ? undefined : form.stormSeen === 'yes',
    startTime: form.startTime ? form.startTime.slice(0, 16) : null,
    hail: form.hail,
    windDamage: form.windDamage,
    cropDamage: form.cropDamage,
    actionTaken: form.actionTaken,
    usefulness: form.usefulness === '' ? undefined : Number(form.usefulness),
    notes: form.notes,
  };
  const parsed = FieldReportRequest.safeParse(
    input satisfies Partial<Record<keyof FieldReportInput, unknown>>,
  );
  if (parsed.success) return { ok: true, body: parsed.data };
  const errors = fieldErrorsFromZod(parsed.error);
  // The schema's cross-field checks run only once every field is well formed; say this one at once too.
  if (form.stormSeen === 'yes' && !form.startTime)
    errors.startTime ??= 'Give the local time the storm started';
  return { ok: false, errors };
}
