import { Select, SelectItem, TextInput } from '@carbon/react';
import type { SiteField } from '../siteFields';

interface SiteFieldInputProps {
  field: SiteField;
  value: string;
  /** The default as text, shown in the help; none for the site's own fields. */
  defaultValue?: string;
  error?: string;
  readOnly?: boolean;
  onChange: (value: string) => void;
}

function idOf(key: string): string {
  return `site-${key.replaceAll('.', '-')}`;
}

/** One field of the site form: its label carries the unit, its help the default. */
export function SiteFieldInput({
  field,
  value,
  defaultValue,
  error,
  readOnly,
  onChange,
}: SiteFieldInputProps) {
  if (field.kind === 'choice') {
    const defaultText = field.options.find((o) => o.value === defaultValue)?.text;
    return (
      <Select
        id={idOf(field.key)}
        labelText={field.label}
        helperText={defaultText ? `${field.help} Default: ${defaultText}.` : field.help}
        value={value}
        invalid={Boolean(error)}
        invalidText={error}
        onChange={(e) => onChange(e.target.value)}
      >
        {field.options.map((o) => (
          <SelectItem key={o.value} value={o.value} text={o.text} />
        ))}
      </Select>
    );
  }
  const label = field.kind === 'number' ? `${field.label} (${field.unit})` : field.label;
  const unitAfterDefault = field.kind === 'number' && field.unit !== 'no unit' ? ` ${field.unit}` : '';
  return (
    <TextInput
      id={idOf(field.key)}
      labelText={label}
      helperText={defaultValue ? `${field.help} Default: ${defaultValue}${unitAfterDefault}.` : field.help}
      value={value}
      inputMode={field.kind === 'number' ? 'decimal' : undefined}
      readOnly={readOnly}
      invalid={Boolean(error)}
      invalidText={error}
      onChange={(e) => onChange(e.target.value)}
    />
  );
}
