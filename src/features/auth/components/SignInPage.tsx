import { useState, type FormEvent } from 'react';
import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import type { LoginInput } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { TextField } from '../../../components/ui/Field';
import { ApiError } from '../../../lib/api-client';
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
  const [values, setValues] = useState<LoginInput>({ email: '', password: '' });
  const [errors, setErrors] = useState<Partial<Record<keyof LoginInput, string>>>({});
  const [touched, setTouched] = useState<Partial<Record<keyof LoginInput, boolean>>>({});
  const [message, setMessage] = useState('');

  if (user) return <Navigate to={next} replace />;

  /** The shared schema the server parses, loaded on first use so the sign-in page ships without zod. */
  const check = async (v: LoginInput) => {
    const { loginSchema } = await import('../../../../shared/schemas/auth');
    const parsed = loginSchema.safeParse(v);
    const found: typeof errors = {};
    if (!parsed.success) for (const issue of parsed.error.issues) found[issue.path[0] as keyof LoginInput] ??= issue.message;
    return { found, data: parsed.success ? parsed.data : null };
  };
  const field = (name: keyof LoginInput) => ({
    name,
    value: values[name],
    onFocus: () => void import('../../../../shared/schemas/auth'),
    onChange: (e: { target: { value: string } }) => {
      const next = { ...values, [name]: e.target.value };
      setValues(next);
      if (touched[name]) void check(next).then(({ found }) => setErrors((was) => ({ ...was, [name]: found[name] })));
    },
    onBlur: () => {
      setTouched((t) => ({ ...t, [name]: true }));
      void check(values).then(({ found }) => setErrors((was) => ({ ...was, [name]: found[name] })));
    },
  });

  const onSubmit = async (e: FormEvent) => {
    e.preventDefault();
    setMessage('');
    setTouched({ email: true, password: true });
    const { found, data } = await check(values);
    setErrors(found);
    if (!data) return;
    try {
      await login.mutateAsync(data);
      navigate(next, { replace: true });
    } catch (err) {
      if (!(err instanceof ApiError)) return setMessage('Something went wrong. Try again.');
      const onFields = err.issues.filter((i) => i.path === 'email' || i.path === 'password');
      setErrors(Object.fromEntries(onFields.map((i) => [i.path, i.message])));
      setMessage(onFields.length === err.issues.length && onFields.length > 0 ? '' : err.message);
    }
  };

  return (
    <AuthCard title="Sign in to the casebook" lead="Falsetrace keeps the team's measurements that lied — and why.">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {params.get('ended') && <Alert tone="caution">Your session ended. Sign in again to go on.</Alert>}
        {message && <Alert tone="caution">{message}</Alert>}
        <TextField label="E-mail" type="email" autoComplete="username" error={errors.email} {...field('email')} />
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          error={errors.password}
          {...field('password')}
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
