import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { TextField } from '../../../components/ui/Field';

interface Values {
  password: string;
  confirm: string;
}

/** Password + confirmation, shared by the invitation and reset forms. */
export function NewPasswordFields({ register, errors }: { register: UseFormRegister<Values>; errors: FieldErrors<Values> }) {
  return (
    <>
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters. A short sentence is easy to remember."
        error={errors.password?.message}
        {...register('password')}
      />
      <TextField label="Repeat the password" type="password" autoComplete="new-password" error={errors.confirm?.message} {...register('confirm')} />
    </>
  );
}
