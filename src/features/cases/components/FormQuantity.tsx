import { useController, type FieldPathByValue } from 'react-hook-form';
import { QuantityField } from '../../../components/ui/QuantityField';
import type { QuantityUnit } from '../../../lib/quantity';
import type { CaseFormApi, CaseFormValues } from '../form/case-form-schema';

export interface FormQuantityProps {
  form: CaseFormApi;
  name: FieldPathByValue<CaseFormValues, string>;
  label: string;
  unit: QuantityUnit;
  placeholder?: string;
  hint?: string;
  disabled?: boolean;
}

/** A quantity field bound to the case form; the schema reports what cannot be parsed. */
export function FormQuantity({ form, name, label, unit, placeholder, hint, disabled }: FormQuantityProps) {
  const { field, fieldState } = useController({ control: form.control, name });
  return (
    <QuantityField
      label={label}
      unit={unit}
      name={field.name}
      ref={field.ref}
      value={field.value as string}
      onChange={(e) => field.onChange(e.target.value)}
      onBlur={field.onBlur}
      error={fieldState.error?.message}
      placeholder={placeholder}
      hint={hint}
      disabled={disabled}
    />
  );
}
