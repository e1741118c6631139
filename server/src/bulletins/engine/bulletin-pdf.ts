import { createRequire } from 'node:module';
import type { BulletinContent } from '@stormhour/shared';
import PDFDocument from 'pdfkit';
import { pdfTable } from '../../common/pdf-table.js';
import { bulletinTitle, hourLabel, percent } from './bulletin-text.js';
import { type RichBlock, richTextBlocks, type TextRun } from './rich-text.js';

/**
 * The bulletin as an A4 PDF in the app's own shipped font (IBM Plex Sans from @fontsource), so making it
 * needs no network and no system fonts. The Latin subset covers the languages the demo uses.
 */
const require = createRequire(import.meta.url);
export const FONTS = {
  regular: require.resolve('@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-400-normal.woff'),
  italic: require.resolve('@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-400-italic.woff'),
  bold: require.resolve('@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-600-normal.woff'),
  boldItalic: require.resolve('@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-600-italic.woff'),
};

const MARGIN = 50;

export function bulletinPdf(c: BulletinContent): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margin: MARGIN,
    info: { Title: bulletinTitle(c), Author: c.unitName, Subject: `${c.districtName} ${c.number}` },
  });
  for (const [name, path] of Object.entries(FONTS)) doc.registerFont(name, path);
  const done = new Promise<Buffer>((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  doc.font('bold').fontSize(16).text(`${c.districtName}: crop-weather bulletin ${c.number}`);
  doc
    .font('regular')
    .fontSize(10)
    .text(`Valid ${c.weekStart} to ${c.weekEnd}. Issued ${c.issueDate} by ${c.unitName}.`)
    .text(c.regimeLabel ? `Expected large-scale regime: ${c.regimeLabel}.` : 'All days of the record.');
  doc.moveDown();
  richText(doc, richTextBlocks(c.summary));

  heading(
    doc,
    `Chance of an afternoon storm (${hourLabel(c.afternoonFromHour)}–${hourLabel(c.afternoonToHour)} local)`,
  );
  pdfTable(
    doc,
    MARGIN,
    ['Block', 'Chance', '90 % interval', 'n', 'Peak', 'In words'],
    [110, 50, 80, 35, 40, 180],
    c.outlook.map((b) => [
      b.blockName,
      percent(b.afternoonChance),
      b.lower === null || b.upper === null ? '' : `${percent(b.lower)}–${percent(b.upper)}`,
      String(b.n),
      hourLabel(b.peakHourLocal),
      b.inWords,
    ]),
  );

  heading(doc, 'Crop advice');
  for (const a of c.crops) {
    doc.font('bold').fontSize(10).text(`${a.crop}, ${a.stage}`);
    richText(doc, richTextBlocks(a.advice));
  }
  heading(doc, 'General advice');
  richText(doc, richTextBlocks(c.generalAdvice));
  heading(doc, 'Cautions');
  richText(doc, [
    { kind: 'list', ordered: false, items: c.cautions.map((t) => [{ text: t, em: false, strong: false }]) },
  ]);
  doc.end();
  return done;
}

function heading(doc: PDFKit.PDFDocument, text: string) {
  doc.moveDown(0.8).font('bold').fontSize(12).text(text, MARGIN).moveDown(0.3);
}

function richText(doc: PDFKit.PDFDocument, blocks: RichBlock[]) {
  const runs = (items: TextRun[], indent: number) => {
    items.forEach((r, i) => {
      const font = r.strong ? (r.em ? 'boldItalic' : 'bold') : r.em ? 'italic' : 'regular';
      doc
        .font(font)
        .fontSize(10)
        .text(r.text, i === 0 ? MARGIN + indent : undefined, undefined, {
          continued: i < items.length - 1,
        });
    });
  };
  for (const b of blocks) {
    if (b.kind === 'paragraph') runs(b.runs, 0);
    else
      b.items.forEach((item, i) => {
        runs([{ text: b.ordered ? `${i + 1}. ` : '• ', em: false, strong: false }, ...item], 10);
      });
    doc.moveDown(0.4);
  }
  doc.x = MARGIN;
}
