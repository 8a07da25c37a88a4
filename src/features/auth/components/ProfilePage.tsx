import { useState } from 'react';
import { changePasswordSchema, confirmedPassword, newPasswordSchema, profileSchema } from '../../../../shared/schemas/auth';
import { ROLE_LABELS } from '../../../../shared/auth/roles';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { TextField } from '../../../components/ui/Field';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { applyServerError, useZodForm } from '../../../lib/forms';
import { useChangePassword } from '../api/change-password';
import { useMe } from '../api/get-me';
import { useUpdateProfile } from '../api/update-profile';
import { NotificationPrefs } from '../../notifications/components/NotificationPrefs';
import { SavedSearchList } from '../../saved-searches/components/SavedSearchList';

const passwordFormSchema = confirmedPassword(
  { currentPassword: changePasswordSchema.shape.currentPassword, newPassword: newPasswordSchema },
  'newPassword',
);

function NameForm({ name }: { name: string }) {
  const update = useUpdateProfile();
  const form = useZodForm(profileSchema, { name });
  const [message, setMessage] = useState('');
  const onSubmit = form.handleSubmit(async (values) => {
    setMessage('');
    try {
      await update.mutateAsync(values);
      form.reset(values);
    } catch (err) {
      setMessage(applyServerError(form, err));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {message && <Alert tone="caution">{message}</Alert>}
      {update.isSuccess && !form.formState.isDirty && <Alert tone="agree">Name saved.</Alert>}
      <TextField label="Name shown on your cases" error={form.formState.errors.name?.message} {...form.register('name')} />
      <div>
        <Button type="submit" busy={update.isPending}>
          Save name
        </Button>
      </div>
    </form>
  );
}

function PasswordForm() {
  const change = useChangePassword();
  const form = useZodForm(passwordFormSchema, { currentPassword: '', newPassword: '', confirm: '' });
  const [message, setMessage] = useState('');
  const { errors } = form.formState;
  const onSubmit = form.handleSubmit(async ({ currentPassword, newPassword }) => {
    setMessage('');
    try {
      await change.mutateAsync({ currentPassword, newPassword });
      form.reset();
    } catch (err) {
      setMessage(applyServerError(form, err));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {message && <Alert tone="caution">{message}</Alert>}
      {change.isSuccess && <Alert tone="agree">Password changed. Your other sessions were signed out.</Alert>}
      <TextField label="Current password" type="password" autoComplete="current-password" error={errors.currentPassword?.message} {...form.register('currentPassword')} />
      <TextField label="New password" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.newPassword?.message} {...form.register('newPassword')} />
      <TextField label="Repeat the new password" type="password" autoComplete="new-password" error={errors.confirm?.message} {...form.register('confirm')} />
      <div>
        <Button type="submit" busy={change.isPending}>
          Change password
        </Button>
      </div>
    </form>
  );
}

export function ProfilePage() {
  const { user } = useMe();
  if (!user) return null;
  return (
    <>
      <PageHeader title="Your profile" lead={<><span className="font-mono">{user.email}</span> · {ROLE_LABELS[user.role]}</>} />
      <div className="grid gap-6 md:grid-cols-2">
        <Panel title="Name">
          <NameForm name={user.name} />
        </Panel>
        <Panel title="Password">
          <PasswordForm />
        </Panel>
      </div>
      <NotificationPrefs role={user.role} />
      <SavedSearchList />
    </>
  );
}
