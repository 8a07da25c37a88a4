import { useState } from 'react';
import { Link } from 'react-router-dom';
import { resetRequestSchema } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { TextField } from '../../../components/ui/Field';
import { applyServerError, useZodForm } from '../../../lib/forms';
import { useRequestReset } from '../api/request-reset';
import { AuthCard } from './AuthCard';

export function ResetRequestPage() {
  const request = useRequestReset();
  const form = useZodForm(resetRequestSchema, { email: '' });
  const [message, setMessage] = useState('');

  const onSubmit = form.handleSubmit(async (values) => {
    setMessage('');
    try {
      await request.mutateAsync(values);
    } catch (err) {
      setMessage(applyServerError(form, err));
    }
  });

  return (
    <AuthCard title="Reset your password" lead="We mail a link that works once and expires in an hour.">
      {request.isSuccess ? (
        <div className="flex flex-col gap-4">
          <Alert tone="agree" title="Check your mail">
            {request.data.message}
          </Alert>
          <Link to="/sign-in" className="text-sm underline underline-offset-2">
            Back to sign-in
          </Link>
        </div>
      ) : (
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
          {message && <Alert tone="caution">{message}</Alert>}
          <TextField label="E-mail" type="email" autoComplete="email" error={form.formState.errors.email?.message} {...form.register('email')} />
          <Button type="submit" busy={request.isPending}>
            Mail me a reset link
          </Button>
          <Link to="/sign-in" className="text-sm underline underline-offset-2">
            Back to sign-in
          </Link>
        </form>
      )}
    </AuthCard>
  );
}
