import { useId, useState } from 'react';
import { parseWeight } from '../model/weight';

interface WeightInputProps {
  label: string;
  weight: number;
  disabled: boolean;
  onChange(weight: number): void;
}

/**
 * A shared atom's weight. It takes what the person types as text and refuses what it cannot use
 * with a message tied to the field (aria-invalid, aria-describedby) — it never quietly keeps the
 * old value while showing the new text. Escape puts the current weight back.
 */
export function WeightInput({ label, weight, disabled, onChange }: WeightInputProps) {
  const id = useId();
  const [text, setText] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const commit = () => {
    if (text === null) return;
    const parsed = parseWeight(text);
    if ('error' in parsed) return setError(parsed.error);
    setError(null);
    setText(null);
    if (parsed.weight !== weight) onChange(parsed.weight);
  };
  return (
    <div className="flex flex-col gap-0.5">
      <div className="flex items-center gap-2">
        <label htmlFor={id} className="text-ink-700">{label}</label>
        <input
          id={id}
          type="text"
          inputMode="decimal"
          disabled={disabled}
          value={text ?? String(weight)}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          onChange={(e) => setText(e.target.value)}
          onBlur={commit}
          onKeyDown={(e) => {
            if (e.key === 'Enter') commit();
            if (e.key === 'Escape') {
              setText(null);
              setError(null);
            }
          }}
          className="w-20 rounded-md border border-paper-400 bg-paper-50 px-2 py-0.5 text-sm tabular-nums aria-invalid:border-alert-600"
        />
      </div>
      {error && <p id={`${id}-error`} className="text-xs text-alert-700">{error}</p>}
    </div>
  );
}
