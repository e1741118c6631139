import { TextInput } from '@carbon/react';
import { useEffect, useState } from 'react';

/**
 * A number typed freely and applied on Enter or when focus leaves, so each keystroke does not start a
 * computation; out-of-range text is named beside the field and not applied.
 */
export function NumberField({
  id,
  label,
  value,
  min,
  max,
  step,
  onCommit,
}: {
  id: string;
  label: string;
  value: number;
  min: number;
  max: number;
  step: number;
  onCommit: (value: number) => void;
}) {
  const [text, setText] = useState(String(value));
  useEffect(() => setText(String(value)), [value]);
  const parsed = Number(text);
  const valid = text.trim() !== '' && Number.isFinite(parsed) && parsed >= min && parsed <= max;
  const commit = () => {
    if (valid && parsed !== value) onCommit(parsed);
  };
  return (
    <TextInput
      id={id}
      size="sm"
      type="number"
      labelText={label}
      value={text}
      min={min}
      max={max}
      step={step}
      invalid={!valid}
      invalidText={`Enter a number from ${min} to ${max}`}
      onChange={(e) => setText(e.target.value)}
      onBlur={commit}
      onKeyDown={(e) => {
        if (e.key === 'Enter') commit();
      }}
    />
  );
}
