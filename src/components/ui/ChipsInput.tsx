import { useId, useState, type KeyboardEvent } from 'react';

export interface ChipsInputProps {
  label: string;
  value: string[];
  onChange: (next: string[]) => void;
  /** Turns typed text into a chip value, or returns an error message. */
  accept?: (text: string) => { ok: true; value: string } | { ok: false; message: string };
  max?: number;
  hint?: string;
  error?: string;
  placeholder?: string;
}

/** Free-form chips (tags): Enter, comma or space adds one, Backspace on an empty box removes the last. */
export function ChipsInput({ label, value, onChange, accept, max = 20, hint, error, placeholder }: ChipsInputProps) {
  const id = useId();
  const [text, setText] = useState('');
  const [problem, setProblem] = useState('');
  const add = (raw: string) => {
    const trimmed = raw.trim();
    if (!trimmed) return;
    const result = accept ? accept(trimmed) : { ok: true as const, value: trimmed };
    if (!result.ok) return setProblem(result.message);
    if (value.includes(result.value)) return setText('');
    if (value.length >= max) return setProblem(`At most ${max}`);
    onChange([...value, result.value]);
    setText('');
    setProblem('');
  };
  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === 'Enter' || e.key === ',' || e.key === ' ') {
      e.preventDefault();
      add(text);
    } else if (e.key === 'Backspace' && text === '' && value.length > 0) {
      onChange(value.slice(0, -1));
    }
  };
  const message = problem || error;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold">
        {label}
      </label>
      <div className={`flex flex-wrap items-center gap-1.5 rounded-md border bg-sheet px-2 py-1.5 focus-within:border-ink ${message ? 'border-caution' : 'border-rule'}`}>
        <ul className="contents" aria-label={`${label}: ${value.length ? value.join(', ') : 'none yet'}`}>
          {value.map((chip) => (
            <li key={chip} className="flex items-center gap-1 rounded-full border border-rule bg-paper py-0.5 pr-1 pl-2.5 font-mono text-xs">
              {chip}
              <button
                type="button"
                onClick={() => onChange(value.filter((c) => c !== chip))}
                className="rounded-full px-1 text-muted hover:text-ink"
                aria-label={`Remove ${chip}`}
              >
                ×
              </button>
            </li>
          ))}
        </ul>
        <input
          id={id}
          value={text}
          onChange={(e) => {
            setText(e.target.value);
            setProblem('');
          }}
          onKeyDown={onKeyDown}
          onBlur={() => add(text)}
          placeholder={value.length === 0 ? placeholder : undefined}
          aria-describedby={message ? `${id}-error` : hint ? `${id}-hint` : undefined}
          aria-invalid={message ? true : undefined}
          className="min-w-[8rem] flex-1 bg-transparent px-1 py-0.5 text-sm focus:outline-none"
        />
      </div>
      {hint && !message && (
        <p id={`${id}-hint`} className="text-xs text-muted">
          {hint}
        </p>
      )}
      {message && (
        <p id={`${id}-error`} className="text-xs font-semibold text-caution">
          {message}
        </p>
      )}
    </div>
  );
}
