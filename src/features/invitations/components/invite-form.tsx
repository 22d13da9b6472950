import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Field, SelectField } from '../../../components/ui/field';
import { fieldErrorsOf } from '../../../lib/api-client';
import { ROLE_LABEL, STUDIO_ROLES } from '../../../lib/roles';
import type { StudioRole } from '../../../types/api';
import { useInviteMember } from '../api/invite-member';

/** Invite someone to the studio by e-mail, in a role (studio owners). */
export function InviteForm({ studioId }: { studioId: number }) {
  const invite = useInviteMember();
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<StudioRole>('viewer');
  const fields = fieldErrorsOf(invite.error);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    invite.mutate({ studioId, email: email.trim(), role }, { onSuccess: () => setEmail('') });
  };
  return (
    <section aria-labelledby="invite-heading" className="flex flex-col gap-3 rounded-md border border-line bg-surface p-4">
      <h2 id="invite-heading" className="text-lg font-semibold">Invite someone</h2>
      {invite.isError && Object.keys(fields).length === 0 && <ErrorNotice title="Could not send the invitation" error={invite.error} />}
      {invite.isSuccess && <p role="status">Invitation sent to {invite.data.invitation.email}.</p>}
      <form onSubmit={submit} className="flex flex-wrap items-end gap-3">
        <Field label="E-mail" type="email" value={email} onChange={(e) => setEmail(e.target.value)} required error={fields.email} />
        <SelectField label="Role" value={role} onChange={(e) => setRole(e.target.value as StudioRole)} error={fields.role}>
          {STUDIO_ROLES.map((r) => <option key={r} value={r}>{ROLE_LABEL[r]}</option>)}
        </SelectField>
        <Button type="submit" variant="primary" busy={invite.isPending} busyLabel="Sending…" disabled={!email.trim()}>Send invitation</Button>
      </form>
    </section>
  );
}
