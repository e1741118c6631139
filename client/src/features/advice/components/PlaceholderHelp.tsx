import { Button } from '@carbon/react';
import { PLACEHOLDERS, type PlaceholderName } from '@stormhour/shared';

/** The placeholders advice text may use; pressing one puts it into the text. */
export function PlaceholderHelp({
  onInsert,
  disabled,
}: {
  onInsert: (name: PlaceholderName) => void;
  disabled: boolean;
}) {
  return (
    <details className="placeholder-help">
      <summary>Placeholders</summary>
      <dl>
        {(Object.entries(PLACEHOLDERS) as [PlaceholderName, string][]).map(([name, meaning]) => (
          <div key={name}>
            <dt>
              <Button kind="ghost" size="sm" disabled={disabled} onClick={() => onInsert(name)}>
                <span className="mono">{`{${name}}`}</span>
                <span className="cds--visually-hidden"> insert</span>
              </Button>
            </dt>
            <dd>{meaning}</dd>
          </div>
        ))}
      </dl>
    </details>
  );
}
