import { Select, SelectItem, TextInput } from '@carbon/react';
import type { SiteView } from '@stormhour/shared';

export type SitePeriodPatch = Partial<Record<'site' | 'from' | 'to', string>>;

/**
 * The radar site and the period (first and last local day, both included) that the Atlas, Regimes and
 * Outlook screens filter by. Rendered as bare fields so each screen places them in its own filter row.
 */
export function SitePeriodFields({
  idPrefix,
  sites,
  siteId,
  from,
  to,
  onChange,
  size,
}: {
  /** Field ids become `${idPrefix}-site`, `-from` and `-to`. */
  idPrefix: string;
  sites: SiteView[];
  siteId: number | string;
  from: string | null | undefined;
  to: string | null | undefined;
  onChange: (patch: SitePeriodPatch) => void;
  size?: 'sm' | 'md' | 'lg';
}) {
  return (
    <>
      <Select
        size={size}
        id={`${idPrefix}-site`}
        labelText="Radar site"
        value={String(siteId)}
        onChange={(e) => onChange({ site: e.target.value })}
      >
        {sites.map((s) => (
          <SelectItem key={s.id} value={String(s.id)} text={`${s.code} — ${s.name}`} />
        ))}
      </Select>
      <TextInput
        size={size}
        id={`${idPrefix}-from`}
        type="date"
        labelText="First day (local)"
        value={from ?? ''}
        onChange={(e) => onChange({ from: e.target.value })}
      />
      <TextInput
        size={size}
        id={`${idPrefix}-to`}
        type="date"
        labelText="Last day (local)"
        value={to ?? ''}
        onChange={(e) => onChange({ to: e.target.value })}
      />
    </>
  );
}
