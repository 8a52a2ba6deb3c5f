import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { MailCheck, Send, UserPlus } from 'lucide-react';
import { roles } from '../../../../shared/auth/roles';
import { invitationSchema, type InvitationInput } from '../../../../shared/mail/account-schemas';
import { roleWords } from '../../../../shared/staff/schemas';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextField } from '../../../components/ui/text-field';
import { useInviteStaff } from '../api/invite-staff';

const until = new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', hour: '2-digit', minute: '2-digit' });

/** "Invite a colleague": an account without a password, and an e-mailed link to set one (valid 7 days). */
export function InviteForm() {
  const [open, setOpen] = useState(false);
  const invite = useInviteStaff();
  const roleId = useId();
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors },
  } = useForm<InvitationInput>({ resolver: zodResolver(invitationSchema), defaultValues: { name: '', email: '', role: 'therapist' } });

  const submit = handleSubmit((values) =>
    invite.mutate(values, {
      onSuccess: () => reset(),
      onError: (error) => {
        // The server names the field at fault (an address already in use): show it beside that field.
        if (error instanceof ApiError && error.fields) {
          for (const [field, message] of Object.entries(error.fields)) {
            if (field === 'name' || field === 'email' || field === 'role') setError(field, { message });
          }
        }
      },
    }),
  );

  if (!open) {
    return (
      <div className="flex flex-col gap-2">
        {invite.isSuccess ? <Sent name={invite.data.member.name} email={invite.data.member.email} expiresAt={invite.data.expiresAt} /> : null}
        <Button className="self-start" onClick={() => {
            invite.reset();
            setOpen(true);
          }}>
          <UserPlus aria-hidden className="h-4 w-4" /> Invite a colleague
        </Button>
      </div>
    );
  }

  const fieldError = invite.error instanceof ApiError && invite.error.fields;
  const serverError = invite.error && !fieldError ? (invite.error instanceof ApiError ? invite.error.message : 'Could not reach Mendstep. Try again.') : null;

  return (
    <section aria-labelledby="invite-heading" className="flex flex-col gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10">
      <h2 id="invite-heading" className="text-lg font-semibold">
        Invite a colleague
      </h2>
      <p className="text-sm text-ink-soft">They receive an e-mail with a link to choose their password. The link works once, for 7 days; no account opens until they use it.</p>
      {invite.isSuccess ? <Sent name={invite.data.member.name} email={invite.data.member.email} expiresAt={invite.data.expiresAt} /> : null}
      {serverError ? (
        <Notice kind="error" title="Not sent">
          {serverError}
        </Notice>
      ) : null}
      <form onSubmit={submit} noValidate aria-label="Invite a colleague" className="grid items-start gap-3 md:grid-cols-[1fr_1fr_auto]">
        <TextField label="Name" autoComplete="off" error={errors.name?.message} {...register('name')} />
        <TextField label="E-mail" type="email" autoComplete="off" error={errors.email?.message} {...register('email')} />
        <div className="flex flex-col gap-1">
          <label htmlFor={roleId} className="text-sm font-medium">
            Role
          </label>
          <select id={roleId} {...register('role')} className="min-h-target rounded-lg border border-ink/30 bg-paper-raised px-3 py-2">
            {roles.map((role) => (
              <option key={role} value={role}>
                {roleWords[role]}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-wrap gap-2 md:col-span-3">
          <Button type="submit" disabled={invite.isPending}>
            <Send aria-hidden className="h-4 w-4" />
            {invite.isPending ? 'Sending…' : 'Send invitation'}
          </Button>
          <Button variant="secondary" onClick={() => setOpen(false)}>
            Close
          </Button>
        </div>
      </form>
    </section>
  );
}

function Sent({ name, email, expiresAt }: { name: string; email: string; expiresAt: string }) {
  return (
    <p role="status" className="flex items-start gap-2 rounded-lg border-l-4 border-moss-500 bg-moss-50 p-3 text-sm">
      <MailCheck aria-hidden className="mt-0.5 h-4 w-4 shrink-0" />
      <span>
        <strong>Invitation sent</strong> to {name} ({email}). The link works until {until.format(new Date(expiresAt))}.
      </span>
    </p>
  );
}
