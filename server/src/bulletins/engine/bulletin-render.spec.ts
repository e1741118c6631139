import { BULLETIN_CAUTIONS, type BulletinContent } from '@stormhour/shared';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { SegmentedMessage } from 'sms-segments-calculator';
import { describe, expect, it } from 'vitest';
import { bulletinPdf } from './bulletin-pdf.js';
import { bulletinHtml, bulletinPlainText, bulletinSms, SMS_MAX_CHARS } from './bulletin-text.js';
import { richTextBlocks, richTextHtml, richTextPlain } from './rich-text.js';

// An invented district of the demo province; the figures are made up for the test.
function content(overrides: Partial<BulletinContent> = {}): BulletinContent {
  return {
    unitName: 'Vessary agro-met unit',
    districtCode: 'RB',
    districtName: 'Riverbend',
    number: 'RB-2025-27',
    issueDate: '2025-06-30',
    weekStart: '2025-07-01',
    weekEnd: '2025-07-07',
    afternoonFromHour: 12,
    afternoonToHour: 18,
    regimeLabel: 'moist / onshore',
    summary: 'Storms likely on **most afternoons**.',
    outlook: [
      {
        blockCode: 'RB-01',
        blockName: 'Ashgrove',
        afternoonChance: 0.48,
        lower: 0.35,
        upper: 0.61,
        n: 40,
        peakHourLocal: 14,
        climatologyChance: 0.25,
        inWords: 'about 1 afternoon in 2 (usually 1 in 4)',
      },
      {
        blockCode: 'RB-02',
        blockName: 'Millbrook',
        afternoonChance: null,
        lower: null,
        upper: null,
        n: 0,
        peakHourLocal: null,
        climatologyChance: null,
        inWords: 'no radar data',
      },
    ],
    crops: [{ crop: 'Rice', stage: 'tillering', advice: '- Top-dress in the *morning*\n- Follow the label' }],
    generalAdvice: 'Keep livestock away from isolated trees.',
    cautions: [...BULLETIN_CAUTIONS],
    ...overrides,
  };
}

describe('rich text', () => {
  it('keeps lists and emphasis and shows raw HTML as text (no injection)', () => {
    const html = richTextHtml('Hello <script>alert(1)</script> *now*\n\n- one\n- **two**');
    expect(html).not.toContain('<script>');
    expect(html).toContain('&lt;script&gt;');
    expect(html).toContain('<em>now</em>');
    expect(html).toContain('<li><strong>two</strong></li>');
  });

  it('turns the same text into blocks and plain text', () => {
    const blocks = richTextBlocks('Say *this*.\n\n1. first\n2. second');
    expect(blocks[0]).toEqual({
      kind: 'paragraph',
      runs: [
        { text: 'Say ', em: false, strong: false },
        { text: 'this', em: true, strong: false },
        { text: '.', em: false, strong: false },
      ],
    });
    expect(blocks[1]).toMatchObject({ kind: 'list', ordered: true });
    expect(richTextPlain('Say *this*.\n\n1. first\n2. second')).toBe('Say this.\n\n1. first\n2. second');
  });
});

describe('bulletin as e-mail text', () => {
  it('escapes names in the HTML and carries every caution', () => {
    const html = bulletinHtml(content({ districtName: 'River<b>bend' }));
    expect(html).toContain('River&#60;b&#62;bend');
    for (const caution of BULLETIN_CAUTIONS) expect(html).toContain(caution.slice(0, 40));
  });

  it('states chance, interval, n and "no data" in the plain text', () => {
    const text = bulletinPlainText(content());
    expect(text).toContain('- Ashgrove: 48 % (90 % interval 35 %–61 %, n = 40), peak 14:00.');
    expect(text).toContain('- Millbrook: no data.');
    expect(text).toContain('- Top-dress in the morning');
    expect(text).toContain('not an official weather warning');
  });
});

describe('bulletin as a short message', () => {
  it('fits three 7-bit SMS segments (GSM 03.38 via sms-segments-calculator) with many blocks', () => {
    const many = Array.from({ length: 30 }, (_, i) => ({
      ...content().outlook[0],
      blockCode: `RB-${i}`,
      blockName: `Block number ${i}`,
      afternoonChance: i / 30,
    }));
    const sms = bulletinSms(content({ outlook: many }));
    const segmented = new SegmentedMessage(sms, 'auto');
    expect(segmented.encodingName).toBe('GSM-7');
    expect(segmented.segmentsCount).toBeLessThanOrEqual(3);
    expect(sms.length).toBeLessThanOrEqual(SMS_MAX_CHARS);
    // Highest chance first, and the caution always kept.
    expect(sms).toMatch(/chance Block number 29 97%/);
    expect(sms).toContain('not an official warning');
  });
});

describe('bulletin as PDF', () => {
  it('is a PDF whose text (read back by pdf.js) names the district and the blocks', async () => {
    const pdf = await bulletinPdf(content());
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const doc = await getDocument({ data: new Uint8Array(pdf), useSystemFonts: false }).promise;
    let text = '';
    for (let p = 1; p <= doc.numPages; p++) {
      const page = await doc.getPage(p);
      const items = (await page.getTextContent()).items as { str: string }[];
      text += items.map((i) => i.str).join(' ');
    }
    // Lines wrap where the page does: compare with single spaces.
    text = text.replace(/\s+/g, ' ');
    expect(text).toContain('Riverbend');
    expect(text).toContain('Ashgrove');
    expect(text).toContain('not an official weather warning');
  });
});
