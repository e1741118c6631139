import {
  type BulletinContent,
  type BulletinWarning,
  formatPercent,
  HIGH_AFTERNOON_CHANCE,
  listInWords,
} from '@stormhour/shared';

/**
 * Advice that says the opposite of the bulletin's own numbers. The checks read the writer's text
 * sentence by sentence with simple word patterns: they catch the usual slips (a copied "dry spell"
 * paragraph, "spray in the afternoon" in a stormy week) and are shown as warnings, never as refusals,
 * because wording can always defeat a pattern.
 */

/** Work that a storm makes dangerous or wasted (a spray washed off, a worker in the open). */
const FIELD_WORK =
  /\b(spray\w*|top-?dress\w*|fertili[sz]\w*|apply\w*|application|field ?work|harvest\w*|weed\w*|plough\w*|transplant\w*|sow\w*)\b/i;
const AFTERNOON = /\b(afternoons?|evenings?|after ?noon|midday|noon|(1[2-8])[:.]?00|[1-6] ?pm)\b/i;
/** Words that turn the sentence into a warning against the work, not advice for it. */
const NEGATION =
  /\b(not|no|never|avoid\w*|don't|do not|postpone\w*|stop\w*|before|until|instead|finish\w*|except|rather than|by)\b|n't\b/i;
const DRY_WORDING =
  /\b(dry spell|dry weather|dry week|rain-?free (week|days?)|no rain|no storms?|harvest now|good week to harvest|little chance of (rain|storms?))\b/i;
const LIGHTNING = /\b(lightning|thunder\w*)\b/i;

/** Sentences of a Markdown text: split after . ! ? and at line breaks (list items). */
export function sentences(text: string): string[] {
  return text
    .split(/\n+/)
    .map((line) => line.replace(/^\s*([-*]|\d+\.)\s+/, ''))
    .flatMap((line) => line.split(/(?<=[.!?])\s+/))
    .map((s) => s.trim())
    .filter(Boolean);
}

function advisoryTexts(c: BulletinContent): { where: string; text: string }[] {
  return [
    { where: 'summary', text: c.summary },
    ...c.crops.map((a, i) => ({ where: `crops[${i}].advice`, text: a.advice })),
    { where: 'generalAdvice', text: c.generalAdvice },
  ];
}

const quote = (s: string) => `“${s.length > 90 ? `${s.slice(0, 87)}…` : s}”`;

export function contradictionWarnings(
  c: BulletinContent,
  high: number = HIGH_AFTERNOON_CHANCE,
): BulletinWarning[] {
  const highBlocks = c.outlook.filter((b) => b.afternoonChance !== null && b.afternoonChance >= high);
  if (highBlocks.length === 0) return [];
  const top = Math.max(...highBlocks.map((b) => b.afternoonChance as number));
  const names = listInWords(highBlocks.map((b) => b.blockName));
  const warnings: BulletinWarning[] = [];
  const texts = advisoryTexts(c);
  for (const { where, text } of texts) {
    for (const s of sentences(text)) {
      if (FIELD_WORK.test(s) && AFTERNOON.test(s) && !NEGATION.test(s))
        warnings.push({
          kind: 'afternoon-work',
          where,
          message: `${quote(s)} recommends afternoon work while the afternoon storm chance is ${formatPercent(top)} in ${names}; advise the morning instead.`,
        });
      if (DRY_WORDING.test(s))
        warnings.push({
          kind: 'dry-wording',
          where,
          message: `${quote(s)} speaks of dry weather while the afternoon storm chance is ${formatPercent(top)} in ${names}.`,
        });
    }
  }
  if (!texts.some((t) => LIGHTNING.test(t.text)))
    for (const b of highBlocks)
      warnings.push({
        kind: 'no-lightning-advice',
        where: `outlook[${b.blockCode}]`,
        message: `${b.blockName} has a ${formatPercent(b.afternoonChance as number)} afternoon storm chance but the advice says nothing about lightning; add lightning safety for field work.`,
      });
  return warnings;
}
