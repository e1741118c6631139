import type { BulletinBlockOutlook, BulletinContent } from '@stormhour/shared';
import { richTextHtml, richTextPlain } from './rich-text.js';

/** A bulletin as e-mail HTML, plain text, and a short form for forwarding by SMS or chat. */

export function percent(p: number | null): string {
  return p === null ? 'no data' : `${Math.round(p * 100)} %`;
}

export function hourLabel(hour: number | null): string {
  return hour === null ? '–' : `${String(hour).padStart(2, '0')}:00`;
}

function intervalLabel(b: BulletinBlockOutlook): string {
  return b.lower === null || b.upper === null ? '' : `${percent(b.lower)}–${percent(b.upper)}`;
}

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

export function bulletinTitle(c: BulletinContent): string {
  return `${c.districtName} crop-weather bulletin ${c.number}, ${c.weekStart} to ${c.weekEnd}`;
}

function windowLabel(c: BulletinContent): string {
  return `${hourLabel(c.afternoonFromHour)}–${hourLabel(c.afternoonToHour)} local time`;
}

export function bulletinHtml(c: BulletinContent): string {
  const cell = 'style="border:1px solid #c6c6c6;padding:4px 8px;text-align:left"';
  const rows = c.outlook
    .map(
      (b) =>
        `<tr><td ${cell}>${escapeHtml(b.blockName)}</td><td ${cell}>${percent(b.afternoonChance)}</td>` +
        `<td ${cell}>${intervalLabel(b)}</td><td ${cell}>${b.n}</td><td ${cell}>${hourLabel(b.peakHourLocal)}</td>` +
        `<td ${cell}>${escapeHtml(b.inWords)}</td></tr>`,
    )
    .join('\n');
  const crops = c.crops
    .map(
      (a) =>
        `<tr><td ${cell}>${escapeHtml(a.crop)}</td><td ${cell}>${escapeHtml(a.stage)}</td><td ${cell}>${richTextHtml(a.advice)}</td></tr>`,
    )
    .join('\n');
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(bulletinTitle(c))}</title></head>
<body style="font-family:'IBM Plex Sans',Arial,sans-serif;color:#161616;max-width:720px">
<h1 style="font-size:20px">${escapeHtml(c.districtName)}: crop-weather bulletin ${escapeHtml(c.number)}</h1>
<p>Valid ${escapeHtml(c.weekStart)} to ${escapeHtml(c.weekEnd)}, issued ${escapeHtml(c.issueDate)} by ${escapeHtml(c.unitName)}.
${c.regimeLabel ? `Expected large-scale regime: <strong>${escapeHtml(c.regimeLabel)}</strong>.` : ''}</p>
${richTextHtml(c.summary)}
<h2 style="font-size:16px">Chance of an afternoon storm (${windowLabel(c)})</h2>
<table style="border-collapse:collapse"><thead><tr><th ${cell}>Block</th><th ${cell}>Chance</th><th ${cell}>90 % interval</th><th ${cell}>Days (n)</th><th ${cell}>Peak hour</th><th ${cell}>In words</th></tr></thead>
<tbody>
${rows}
</tbody></table>
<h2 style="font-size:16px">Crop advice</h2>
<table style="border-collapse:collapse"><thead><tr><th ${cell}>Crop</th><th ${cell}>Stage</th><th ${cell}>Advice</th></tr></thead>
<tbody>
${crops}
</tbody></table>
<h2 style="font-size:16px">General advice</h2>
${richTextHtml(c.generalAdvice)}
<h2 style="font-size:16px">Cautions</h2>
<ul>${c.cautions.map((t) => `<li>${escapeHtml(t)}</li>`).join('')}</ul>
</body></html>`;
}

export function bulletinPlainText(c: BulletinContent): string {
  const lines = [
    bulletinTitle(c),
    `Issued ${c.issueDate} by ${c.unitName}.${c.regimeLabel ? ` Expected regime: ${c.regimeLabel}.` : ''}`,
    '',
    richTextPlain(c.summary),
    '',
    `CHANCE OF AN AFTERNOON STORM (${windowLabel(c)})`,
    ...c.outlook.map(
      (b) =>
        `- ${b.blockName}: ${percent(b.afternoonChance)}${b.lower === null ? '' : ` (90 % interval ${intervalLabel(b)}, n = ${b.n})`}` +
        `${b.peakHourLocal === null ? '' : `, peak ${hourLabel(b.peakHourLocal)}`}. ${b.inWords}`,
    ),
    '',
    'CROP ADVICE',
    ...c.crops.flatMap((a) => [`${a.crop}, ${a.stage}:`, richTextPlain(a.advice), '']),
    'GENERAL ADVICE',
    richTextPlain(c.generalAdvice),
    '',
    'CAUTIONS',
    ...c.cautions.map((t) => `- ${t}`),
  ];
  return `${lines.join('\n').replace(/\n{3,}/g, '\n\n')}\n`;
}

/** Three concatenated SMS of 7-bit text: 3 × 153 characters. */
export const SMS_MAX_CHARS = 459;

/**
 * The short form: the highest chances first, as many blocks as fit, and always the caution. Only
 * characters of the GSM 7-bit alphabet, so the message is not sent as UCS-2 (70 characters a segment).
 */
export function bulletinSms(c: BulletinContent): string {
  const head = `${c.districtName} ${c.number} ${c.weekStart}..${c.weekEnd}: afternoon storm chance`;
  const tail = ' Statistical guidance, not an official warning. Thunder heard: go indoors, wait 30 min.';
  const ranked = [...c.outlook]
    .filter((b) => b.afternoonChance !== null)
    .sort((a, b) => (b.afternoonChance ?? 0) - (a.afternoonChance ?? 0));
  let body = '';
  for (const b of ranked) {
    const next = `${body}${body ? ',' : ''} ${b.blockName} ${Math.round((b.afternoonChance ?? 0) * 100)}%`;
    if (gsmSafe(`${head}${next}.${tail}`).length > SMS_MAX_CHARS) break;
    body = next;
  }
  return gsmSafe(`${head}${body}.${tail}`);
}

/** Replaces the typographic characters we use elsewhere with their plain 7-bit forms. */
function gsmSafe(text: string): string {
  return text
    .replace(/[–—]/g, '-')
    .replace(/[‘’]/g, "'")
    .replace(/[“”]/g, '"')
    .replace(/…/g, '...')
    .normalize('NFKD')
    .replace(/[^\x20-\x7e\n]/g, '');
}
