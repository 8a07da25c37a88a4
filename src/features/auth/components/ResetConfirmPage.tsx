import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { confirmedPassword, newPasswordSchema } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { applyServerError, useZodForm } from '../../../lib/forms';
import { useConfirmReset } from '../api/confirm-reset';
import { AuthCard } from './AuthCard';
import { NewPasswordFields } from './NewPasswordFields';

const formSchema = confirmedPassword({ password: newPasswordSchema }, 'password');

export function ResetConfirmPage() {
  const { token = '' } = useParams();
  const confirm = useConfirmReset();
  const form = useZodForm(formSchema, { password: '', confirm: '' });
  const [message, setMessage] = useState('');

  const onSubmit = form.handleSubmit(async ({ password }) => {
    setMessage('');
    try {
      await confirm.mutateAsync({ token, password });
    } catch (err) {
      setMessage(applyServerError(form, err));
    }
  });

  if (confirm.isSuccess) {
    return (
      <AuthCard title="Password changed">
        <Alert tone="agree">Your new password is set and your other sessions were signed out.</Alert>
        <Link to="/sign-in" className="mt-4 inline-block font-semibold underline underline-offset-2">
          Sign in
        </Link>
      </AuthCard>
    );
  }
  return (
    <AuthCard title="Choose a new password">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {message && (
          <Alert tone="caution">
            {message} <Link to="/reset-password" className="underline">Ask for a new link</Link>
          </Alert>
        )}
        <NewPasswordFields register={form.register as never} errors={form.formState.errors} />
        <Button type="submit" busy={confirm.isPending}>
          Set the new password
        </Button>
      </form>
    </AuthCard>
  );
}
