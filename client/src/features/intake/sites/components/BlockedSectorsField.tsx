import { Button, TextInput } from '@carbon/react';
import type { SiteFormValues } from '../siteForm';

type Sector = SiteFormValues['sectors'][number];

interface BlockedSectorsFieldProps {
  sectors: Sector[];
  errors: Record<string, string>;
  onChange: (sectors: Sector[]) => void;
}

/** Azimuth sectors the beam cannot see; each row is one sector, clockwise from "from" to "to". */
export function BlockedSectorsField({ sectors, errors, onChange }: BlockedSectorsFieldProps) {
  const update = (index: number, patch: Partial<Sector>) =>
    onChange(sectors.map((s, i) => (i === index ? { ...s, ...patch } : s)));
  return (
    <fieldset className="site-form__section">
      <legend className="section-title">Blocked sectors</legend>
      <p className="cds--label-description">
        Directions where terrain or buildings block the beam, in degrees clockwise from north. Cells there are
        outside coverage. A sector may cross north, e.g. from 350° to 10°.
      </p>
      {sectors.length === 0 ? <p>No blocked sectors: the site sees all round.</p> : null}
      {sectors.map((sector, index) => (
        // Rows have no identity of their own; they are edited in place and never reordered.
        // biome-ignore lint/suspicious/noArrayIndexKey: see above.
        <div key={index} className="site-form__sector">
          <TextInput
            id={`sector-${index}-from`}
            labelText={`Sector ${index + 1} from (°)`}
            inputMode="decimal"
            value={sector.fromDeg}
            invalid={Boolean(errors[`blockedSectors.${index}.fromDeg`])}
            invalidText={errors[`blockedSectors.${index}.fromDeg`]}
            onChange={(e) => update(index, { fromDeg: e.target.value })}
          />
          <TextInput
            id={`sector-${index}-to`}
            labelText={`Sector ${index + 1} to (°)`}
            inputMode="decimal"
            value={sector.toDeg}
            invalid={Boolean(errors[`blockedSectors.${index}.toDeg`])}
            invalidText={errors[`blockedSectors.${index}.toDeg`]}
            onChange={(e) => update(index, { toDeg: e.target.value })}
          />
          <Button kind="ghost" size="md" onClick={() => onChange(sectors.filter((_, i) => i !== index))}>
            Remove sector {index + 1}
          </Button>
          {errors[`blockedSectors.${index}`] ? (
            <p className="field-problem" role="alert">
              {errors[`blockedSectors.${index}`]}
            </p>
          ) : null}
        </div>
      ))}
      <Button kind="tertiary" size="sm" onClick={() => onChange([...sectors, { fromDeg: '', toDeg: '' }])}>
        Add a blocked sector
      </Button>
    </fieldset>
  );
}
