import type { DiffLine } from '@stormhour/shared';
import { diffLines } from 'diff';

/** A line diff of two plain-text renderings (jsdiff's Myers diff), one entry per line. */
export function textDiff(
  before: string,
  after: string,
): { lines: DiffLine[]; added: number; removed: number } {
  const lines: DiffLine[] = [];
  let added = 0;
  let removed = 0;
  for (const change of diffLines(before, after)) {
    const op = change.added ? 'added' : change.removed ? 'removed' : 'same';
    // Each change holds whole lines, the last one ending in a newline (or the text's end).
    const texts = change.value.replace(/\n$/, '').split('\n');
    for (const text of texts) lines.push({ op, text });
    if (op === 'added') added += texts.length;
    if (op === 'removed') removed += texts.length;
  }
  return { lines, added, removed };
}
