import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { ROLE_LABELS } from '../../../../shared/auth/roles';
import { confirmedPassword, newPasswordSchema, personNameSchema } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { TextField } from '../../../components/ui/Field';
import { Loading } from '../../../components/ui/Panel';
import { applyServerError, useZodForm } from '../../../lib/forms';
import { useAcceptInvitation } from '../api/accept-invitation';
import { useInvitation } from '../api/get-invitation';
import { AuthCard } from './AuthCard';
import { NewPasswordFields } from './NewPasswordFields';

const formSchema = confirmedPassword({ name: personNameSchema, password: newPasswordSchema }, 'password');

export function AcceptInvitationPage() {
  const { token = '' } = useParams();
  const invitation = useInvitation(token);
  const accept = useAcceptInvitation();
  const navigate = useNavigate();
  const form = useZodForm(formSchema, { name: '', password: '', confirm: '' });
  const [message, setMessage] = useState('');

  if (invitation.isPending) return <Loading what="Checking the invitation" />;
  if (invitation.isError) {
    return (
      <AuthCard title="This invitation cannot be used">
        <Alert tone="caution">{invitation.error.message}</Alert>
        <p className="mt-4 text-sm">
          Ask an admin to invite you again, or <Link to="/sign-in" className="underline">sign in</Link> if you already have an account.
        </p>
      </AuthCard>
    );
  }
  const { email, role } = invitation.data.invitation;

  const onSubmit = form.handleSubmit(async ({ name, password }) => {
    setMessage('');
    try {
      await accept.mutateAsync({ token, name, password });
      navigate('/', { replace: true });
    } catch (err) {
      setMessage(applyServerError(form, err));
    }
  });

  return (
    <AuthCard title="Join the casebook" lead={<>You were invited as <strong>{ROLE_LABELS[role]}</strong> with <span className="font-mono">{email}</span>.</>}>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {message && <Alert tone="caution">{message}</Alert>}
        <TextField label="Your name" autoComplete="name" error={form.formState.errors.name?.message} {...form.register('name')} />
        <NewPasswordFields register={form.register as never} errors={form.formState.errors} />
        <Button type="submit" busy={accept.isPending}>
          Create my account
        </Button>
      </form>
    </AuthCard>
  );
}
