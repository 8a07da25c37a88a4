import { useState } from 'react';
import { ROLE_LABELS, ROLES } from '../../../../shared/auth/roles';
import { inviteSchema } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { SelectField, TextField } from '../../../components/ui/Field';
import { applyServerError, useZodForm } from '../../../lib/forms';
import { useInvitePerson } from '../api/invite-person';

const roleOptions = ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }));

export function InviteForm() {
  const invite = useInvitePerson();
  const form = useZodForm(inviteSchema, { email: '', role: 'engineer' });
  const [message, setMessage] = useState('');
  const [sentTo, setSentTo] = useState('');

  const onSubmit = form.handleSubmit(async (values) => {
    setMessage('');
    setSentTo('');
    try {
      const { invitation } = await invite.mutateAsync(values);
      setSentTo(invitation.email);
      form.reset({ email: '', role: values.role });
    } catch (err) {
      setMessage(applyServerError(form, err));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {message && <Alert tone="caution">{message}</Alert>}
      {sentTo && <Alert tone="agree">Invitation mailed to {sentTo}. The link works once, for 72 hours.</Alert>}
      <div className="grid gap-4 sm:grid-cols-[1fr_12rem]">
        <TextField label="E-mail to invite" type="email" error={form.formState.errors.email?.message} {...form.register('email')} />
        <SelectField label="Role" options={roleOptions} error={form.formState.errors.role?.message} {...form.register('role')} />
      </div>
      <div>
        <Button type="submit" busy={invite.isPending}>
          Send invitation
        </Button>
      </div>
    </form>
  );
}
