import { InlineNotification } from '@carbon/react';
import type { BulletinWarning } from '@stormhour/shared';

const PLACES: Record<string, string> = { summary: 'Summary', generalAdvice: 'General advice' };

/** "crops[2].advice" → "Crop advice, row 3"; "outlook[RVB-03]" → "Outlook, RVB-03". */
export function placeName(where: string): string {
  const crop = /^crops\[(\d+)\]/.exec(where);
  if (crop) return `Crop advice, row ${Number(crop[1]) + 1}`;
  const block = /^outlook\[(.+)\]$/.exec(where);
  if (block) return `Outlook, ${block[1]}`;
  return PLACES[where] ?? where;
}

/** Where the advice contradicts the bulletin's own numbers. Warnings inform; they do not stop a save. */
export function WarningsPanel({ warnings }: { warnings: BulletinWarning[] }) {
  if (warnings.length === 0)
    return (
      <p className="cds--label-description">No contradiction found between the advice and the numbers.</p>
    );
  return (
    <ul className="bulletin-warnings" aria-label="Warnings">
      {warnings.map((w) => (
        <li key={`${w.kind}-${w.where}`}>
          <InlineNotification
            kind="warning"
            lowContrast
            hideCloseButton
            title={placeName(w.where)}
            subtitle={w.message}
          />
        </li>
      ))}
    </ul>
  );
}
