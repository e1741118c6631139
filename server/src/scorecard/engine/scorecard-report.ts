import type { ScorecardPair, ScorecardView, ScoreInterval } from '@stormhour/shared';
import Papa from 'papaparse';
import PDFDocument from 'pdfkit';
import { FONTS } from '../../bulletins/engine/bulletin-pdf.js';
import { pdfTable } from '../../common/pdf-table.js';

/** The pairs as CSV, one row per bulletin, block and day: what every score is computed from. */
export function scorecardCsv(pairs: readonly ScorecardPair[]): string {
  return Papa.unparse(
    pairs.map((p) => ({
      date: p.date,
      block_code: p.blockCode,
      block_name: p.blockName,
      bulletin: p.bulletinNumber,
      chance: p.chance,
      climatology_chance: p.climatologyChance ?? '',
      observed: p.observed,
      source: p.source,
    })),
    {
      columns: [
        'date',
        'block_code',
        'block_name',
        'bulletin',
        'chance',
        'climatology_chance',
        'observed',
        'source',
      ],
    },
  );
}

const fixed = (v: number | null, digits = 3) => (v === null ? '–' : v.toFixed(digits));
const withInterval = (v: number | null, i: ScoreInterval | null, digits = 3) =>
  i
    ? `${fixed(v, digits)} (90 % interval ${fixed(i.lower, digits)} to ${fixed(i.upper, digits)})`
    : fixed(v, digits);
const pct = (v: number | null) => (v === null ? '–' : `${Math.round(v * 100)} %`);

const MARGIN = 50;

/** The season's scorecard as an A4 PDF in the app's shipped fonts. */
export function scorecardPdf(v: ScorecardView, unitName: string): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margin: MARGIN,
    info: { Title: `Scorecard ${v.districtName} ${v.from} to ${v.to}`, Author: unitName },
  });
  for (const [name, path] of Object.entries(FONTS)) doc.registerFont(name, path);
  const done = new Promise<Buffer>((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const heading = (text: string) =>
    doc.moveDown(0.8).font('bold').fontSize(12).text(text, MARGIN).moveDown(0.3);
  const line = (text: string) => doc.font('regular').fontSize(10).text(text, MARGIN);

  doc.font('bold').fontSize(16).text(`${v.districtName}: scorecard of the afternoon storm chances`);
  line(`Days ${v.from} to ${v.to}. Outcomes from: ${v.source}. ${unitName}.`);
  line(
    `${v.bulletins} sent bulletins, ${v.pairs} block-days scored over ${v.days} days; a storm started on ${v.events} of them.`,
  );

  heading('Scores');
  line(`Brier score (0 is perfect): ${withInterval(v.brier, v.brierInterval)}`);
  line(`Brier score of the usual (all-days) chances: ${fixed(v.climatologyBrier)}`);
  line(`Skill against the usual chances (above 0 is better): ${withInterval(v.skill, v.skillInterval)}`);
  line(`ROC area (0.5 is no skill, 1 perfect): ${withInterval(v.roc.area, v.rocAreaInterval)}`);
  if (v.murphy)
    line(
      `Murphy decomposition: reliability ${fixed(v.murphy.reliability, 4)}, resolution ${fixed(v.murphy.resolution, 4)}, uncertainty ${fixed(v.murphy.uncertainty, 4)}.`,
    );
  if (v.resamples > 0) line(`Intervals: ${v.resamples} bootstrap resamples of whole days.`);

  heading('Reliability');
  reliabilityDiagram(doc, v);
  pdfTable(
    doc,
    MARGIN,
    ['Issued chance', 'Cases', 'Mean chance', 'Observed', '90 % interval'],
    [100, 60, 80, 80, 120],
    v.reliability.map((r) => [
      `${pct(r.lower)}–${pct(r.upper)}`,
      `${r.count}${r.few && r.count > 0 ? ' (few)' : ''}`,
      pct(r.meanChance),
      pct(r.observedFrequency),
      r.interval ? `${pct(r.interval.lower)}–${pct(r.interval.upper)}` : '–',
    ]),
  );

  heading('At the advice thresholds');
  pdfTable(
    doc,
    MARGIN,
    ['Yes from', 'Hits', 'Misses', 'False alarms', 'Hit rate', 'False-alarm ratio'],
    [70, 50, 50, 80, 70, 100],
    v.thresholds.map((t) => [
      pct(t.threshold),
      String(t.hits),
      String(t.misses),
      String(t.falseAlarms),
      pct(t.hitRate),
      pct(t.falseAlarmRatio),
    ]),
  );

  heading('Radar and field reports on the same block-days');
  line(
    `Both saw a storm: ${v.agreement.both}; radar only: ${v.agreement.radarOnly}; reports only: ${v.agreement.reportOnly}; neither: ${v.agreement.neither}.`,
  );

  heading('Blocks, worst first');
  pdfTable(
    doc,
    MARGIN,
    ['Block', 'Days', 'Storms', 'Brier', 'Skill', 'Bulletins'],
    [110, 40, 45, 50, 50, 200],
    v.blocks
      .slice(0, 20)
      .map((b) => [
        `${b.blockName} (${b.blockCode})`,
        String(b.pairs),
        String(b.events),
        fixed(b.brier),
        fixed(b.skill, 2),
        b.bulletins.map((x) => x.number).join(', '),
      ]),
  );
  doc.moveDown();
  doc
    .font('italic')
    .fontSize(9)
    .text(
      'These scores describe statistical guidance, not official warnings. Few cases give wide intervals: read them with their uncertainty.',
      MARGIN,
    );
  doc.end();
  return done;
}

/** Observed frequency against mean issued chance per bin, over the diagonal of perfect reliability. */
function reliabilityDiagram(doc: PDFKit.PDFDocument, v: ScorecardView) {
  const size = 160;
  const left = MARGIN + 30;
  const top = doc.y + 5;
  const x = (p: number) => left + p * size;
  const y = (p: number) => top + size - p * size;
  doc.lineWidth(0.5).strokeColor('#8d8d8d').rect(left, top, size, size).stroke();
  doc.dash(3, { space: 3 }).moveTo(x(0), y(0)).lineTo(x(1), y(1)).stroke().undash();
  doc.strokeColor('#0f62fe').fillColor('#0f62fe');
  for (const r of v.reliability) {
    if (r.meanChance === null || r.observedFrequency === null) continue;
    if (r.interval)
      doc.moveTo(x(r.meanChance), y(r.interval.lower)).lineTo(x(r.meanChance), y(r.interval.upper)).stroke();
    doc.circle(x(r.meanChance), y(r.observedFrequency), r.few ? 2 : 3.5).fill();
  }
  doc.fillColor('black').font('regular').fontSize(8);
  doc.text('issued chance', left, top + size + 4, { width: size, align: 'center' });
  doc.text('observed', MARGIN - 10, top + size / 2, { width: 40 });
  doc.x = MARGIN;
  doc.y = top + size + 20;
}
