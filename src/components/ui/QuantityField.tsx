import { forwardRef, useId, type InputHTMLAttributes } from 'react';
import { readQuantity, showQuantity, type QuantityUnit } from '../../lib/quantity';

export interface QuantityFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'value'> {
  label: string;
  unit: QuantityUnit;
  value: string;
  /** A message from validation (bounds, parse) to show under the field. */
  error?: string;
  hint?: string;
}

// shown in an empty field, so the unit it expects is plain before anything is typed
const unitHint = (unit: QuantityUnit) => (unit === 'x' ? 'ratio' : unit === '#' ? 'number' : unit);

/**
 * A text input for a measured value in engineering notation ("15 pF", "9Meg", "2.5 ns"):
 * it echoes what it understood beside the field, so a typo shows before it is saved.
 */
export const QuantityField = forwardRef<HTMLInputElement, QuantityFieldProps>(function QuantityField(
  { label, unit, value, error, hint, id, className = '', ...rest },
  ref,
) {
  const autoId = useId();
  const fieldId = id ?? autoId;
  const reading = readQuantity(value ?? '', unit);
  // the parse message itself arrives through `error` (form validation on blur), so typing "9Me" on the way to "9Meg" does not flash a complaint
  const message = error;
  const describedBy = [`${fieldId}-echo`, message ? `${fieldId}-error` : hint ? `${fieldId}-hint` : ''].filter(Boolean).join(' ');
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={fieldId} className="text-sm font-semibold">
        {label}
      </label>
      <div className="relative">
        <input
          ref={ref}
          id={fieldId}
          value={value ?? ''}
          inputMode="text"
          autoComplete="off"
          spellCheck={false}
          aria-invalid={message ? true : undefined}
          aria-describedby={describedBy}
          className={`w-full min-w-0 rounded-md border bg-sheet py-2 pr-24 pl-3 font-mono text-sm leading-6 text-ink placeholder:text-muted/70 focus:border-ink focus:outline-none focus:ring-2 focus:ring-agree/60 ${message ? 'border-caution' : 'border-rule'} ${className}`}
          {...rest}
        />
        {/* the value as understood, inside the box's right end so every field keeps the same width */}
        <output
          id={`${fieldId}-echo`}
          htmlFor={fieldId}
          aria-live="polite"
          className={`pointer-events-none absolute top-1/2 right-2 max-w-[5.5rem] -translate-y-1/2 truncate rounded bg-paper px-1.5 py-0.5 text-right font-mono text-xs ${reading.kind === 'ok' ? 'text-agree' : reading.kind === 'error' ? 'text-caution' : 'text-muted'}`}
          title={reading.kind === 'ok' ? `Read as ${showQuantity(reading.value, unit, 6)}` : undefined}
        >
          {reading.kind === 'ok' ? `= ${showQuantity(reading.value, unit)}` : reading.kind === 'empty' ? unitHint(unit) : '?'}
        </output>
      </div>
      {hint && !message && (
        <p id={`${fieldId}-hint`} className="text-xs text-muted">
          {hint}
        </p>
      )}
      {message && (
        <p id={`${fieldId}-error`} className="text-xs font-semibold text-caution">
          {message}
        </p>
      )}
    </div>
  );
});
