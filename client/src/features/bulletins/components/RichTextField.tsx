import { TextArea } from '@carbon/react';
import { RichText } from '../../../components/bulletin/RichText';

/**
 * A text in the bulletin's Markdown subset, with its rendering beside it as the writer types. A warning
 * from the server (advice that contradicts the numbers) shows under the field; it never blocks saving.
 */
export function RichTextField({
  id,
  label,
  value,
  onChange,
  error,
  warning,
  disabled,
  rows = 4,
}: {
  id: string;
  label: string;
  value: string;
  onChange: (value: string) => void;
  error?: string;
  warning?: string;
  disabled?: boolean;
  rows?: number;
}) {
  return (
    <div className="rich-field">
      <TextArea
        id={id}
        labelText={label}
        helperText="*emphasis*, **strong**, lines starting “- ” or “1. ” for lists"
        rows={rows}
        value={value}
        disabled={disabled}
        invalid={Boolean(error)}
        invalidText={error}
        warn={!error && Boolean(warning)}
        warnText={warning}
        onChange={(event) => onChange(event.target.value)}
      />
      <section className="rich-field__preview" aria-label={`${label}: preview`}>
        {value.trim() ? <RichText source={value} /> : <p className="rich-field__empty">Empty</p>}
      </section>
    </div>
  );
}
