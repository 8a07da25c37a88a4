import { useState } from 'react';
import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { loginSchema } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { TextField } from '../../../components/ui/Field';
import { applyServerError, useZodForm } from '../../../lib/forms';
import { useMe } from '../api/get-me';
import { useLogin } from '../api/login';
import { AuthCard } from './AuthCard';

/** Only same-site paths are followed after sign-in. */
const safeNext = (next: string | null) => (next && next.startsWith('/') && !next.startsWith('//') ? next : '/');

export function SignInPage() {
  const [params] = useSearchParams();
  const next = safeNext(params.get('next'));
  const { user } = useMe();
  const navigate = useNavigate();
  const login = useLogin();
  const form = useZodForm(loginSchema, { email: '', password: '' });
  const [message, setMessage] = useState('');
  const { errors } = form.formState;

  if (user) return <Navigate to={next} replace />;

  const onSubmit = form.handleSubmit(async (values) => {
    setMessage('');
    try {
      await login.mutateAsync(values);
      navigate(next, { replace: true });
    } catch (err) {
      setMessage(applyServerError(form, err));
    }
  });

  return (
    <AuthCard title="Sign in to the casebook" lead="Falsetrace keeps the team's measurements that lied — and why.">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {params.get('ended') && <Alert tone="caution">Your session ended. Sign in again to go on.</Alert>}
        {message && <Alert tone="caution">{message}</Alert>}
        <TextField label="E-mail" type="email" autoComplete="username" error={errors.email?.message} {...form.register('email')} />
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          error={errors.password?.message}
          {...form.register('password')}
        />
        <Button type="submit" busy={login.isPending}>
          Sign in
        </Button>
        <p className="text-sm">
          <Link to="/reset-password" className="underline underline-offset-2">
            Forgot your password?
          </Link>
        </p>
      </form>
    </AuthCard>
  );
}
