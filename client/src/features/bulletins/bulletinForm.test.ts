import { describe, expect, it } from 'vitest';
import { aBulletinContent } from '../../test/bulletinBuilders';
import {
  checkBulletinForm,
  formFromBulletin,
  newCropRow,
  sameForm,
  warningField,
  warningsByField,
} from './bulletinForm';

describe('the bulletin form', () => {
  const form = formFromBulletin({ content: aBulletinContent() });

  it('starts from the stored content and knows when it has changed', () => {
    expect(form.crops.map((c) => c.crop)).toEqual(['rice']);
    expect(sameForm(form, formFromBulletin({ content: aBulletinContent() }))).toBe(true);
    expect(sameForm(form, { ...form, summary: 'Other.' })).toBe(false);
  });

  it('sends the parts the writer edits, with the version the edit started from', () => {
    const checked = checkBulletinForm(form, 3);
    expect(checked).toEqual({
      ok: true,
      body: {
        baseVersion: 3,
        issueDate: '2025-06-28',
        summary: 'Afternoon storms are likely in the hills.',
        crops: [{ crop: 'rice', stage: 'tillering', advice: 'Spray in the morning.' }],
        generalAdvice: 'Keep livestock away from lone trees.',
      },
    });
  });

  it('names each field that is wrong, by row', () => {
    const checked = checkBulletinForm(
      { ...form, issueDate: '28/06/2025', crops: [...form.crops, newCropRow('', 'flowering', 'x')] },
      3,
    );
    expect(checked.ok).toBe(false);
    if (checked.ok) return;
    expect(checked.errors).toEqual({
      issueDate: 'Give a date such as 2025-09-29',
      'crops.1.crop': 'Name the crop',
    });
  });

  it('puts the server’s warnings beside the field they name', () => {
    expect(warningField('crops[2].advice')).toBe('crops.2.advice');
    expect(
      warningsByField([
        {
          kind: 'afternoon-work',
          where: 'crops[0].advice',
          message: 'Afternoon spraying with a 52 % chance.',
        },
        { kind: 'dry-wording', where: 'summary', message: '“Dry week” while Sallow Ford has 52 %.' },
      ]),
    ).toEqual({
      'crops.0.advice': 'Afternoon spraying with a 52 % chance.',
      summary: '“Dry week” while Sallow Ford has 52 %.',
    });
  });
});
