import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { MissingNotice, PageHeading } from '../../../components/ui/page-heading';
import { Spinner } from '../../../components/ui/spinner';
import { isApiError } from '../../../lib/api-client';
import { ROLE_LABEL, STUDIO_ROLES } from '../../../lib/roles';
import type { StudioMember, StudioRole } from '../../../types/api';
import { useStudio } from '../api/get-studio';
import { useRemoveMember } from '../api/remove-member';
import { useUpdateMemberRole } from '../api/update-member-role';

export interface StudioMembersProps {
  studioId: number;
  currentUserId: number;
  /** Called after the signed-in weaver leaves the studio. */
  onLeft: () => void;
}

/** A studio's members and roles. Only an owner sees the controls to change roles or remove people. */
export function StudioMembers({ studioId, currentUserId, onLeft }: StudioMembersProps) {
  const query = useStudio(studioId);

  if (query.isPending) return <Spinner label="Loading the studio…" />;
  if (query.isError) {
    if (isApiError(query.error, 404)) {
      return (
        <MissingNotice title="Studio not found" back={{ to: '/studios', label: 'Back to Studios' }}>
          This studio does not exist, or you are not one of its members.
        </MissingNotice>
      );
    }
    return <ErrorNotice title="Could not load the studio" error={query.error} onRetry={() => void query.refetch()} />;
  }

  const { studio, members } = query.data;
  const isOwner = studio.role === 'owner';
  return (
    <div className="flex flex-col gap-4">
      <PageHeading title={studio.name} back={{ to: '/studios', label: 'Studios' }}>
        <p className="text-sm text-muted">
          Your role: <strong className="font-semibold text-ink">{ROLE_LABEL[studio.role]}</strong>
          {isOwner ? ' — you can change roles and remove members.' : ''}
        </p>
      </PageHeading>
      <div className="overflow-x-auto rounded-md border border-line bg-surface">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">Members of {studio.name}</caption>
          <thead className="border-b border-line bg-sunken">
            <tr>
              <th scope="col" className="px-3 py-2 text-left font-semibold">
                Name
              </th>
              <th scope="col" className="px-3 py-2 text-left font-semibold">
                E-mail
              </th>
              <th scope="col" className="px-3 py-2 text-left font-semibold">
                Role
              </th>
              <th scope="col" className="px-3 py-2 text-left font-semibold">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {members.map((member) => (
              <MemberRow
                key={member.userId}
                studioId={studio.id}
                member={member}
                canManage={isOwner && member.userId !== currentUserId}
                isSelf={member.userId === currentUserId}
                onLeft={onLeft}
              />
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}

interface MemberRowProps {
  studioId: number;
  member: StudioMember;
  /** Owners manage everyone but themselves, so a studio cannot lose its last owner by a slip. */
  canManage: boolean;
  isSelf: boolean;
  onLeft: () => void;
}

function MemberRow({ studioId, member, canManage, isSelf, onLeft }: MemberRowProps) {
  const [role, setRole] = useState<StudioRole>(member.role);
  const [confirming, setConfirming] = useState(false);
  const update = useUpdateMemberRole();
  const remove = useRemoveMember({ onSuccess: () => isSelf && onLeft() });
  const error = update.error ?? remove.error;

  const saveRole = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    update.mutate({ studioId, userId: member.userId, role });
  };
  const removeLabel = isSelf ? 'Leave studio' : 'Remove';

  return (
    <tr className="border-b border-line align-top last:border-b-0">
      <th scope="row" className="px-3 py-2 text-left font-medium">
        {member.name}
        {isSelf && <span className="font-normal text-muted"> (you)</span>}
      </th>
      <td className="px-3 py-2">{member.email}</td>
      <td className="px-3 py-2">
        {canManage ? (
          <form onSubmit={saveRole} className="flex items-center gap-2">
            <label className="sr-only" htmlFor={`role-${member.userId}`}>
              Role of {member.name}
            </label>
            <select
              id={`role-${member.userId}`}
              value={role}
              onChange={(event) => setRole(event.target.value as StudioRole)}
              className="rounded-md border border-field bg-surface px-2 py-1.5"
            >
              {STUDIO_ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABEL[r]}
                </option>
              ))}
            </select>
            <Button type="submit" disabled={role === member.role} busy={update.isPending} busyLabel="Saving…" aria-label={`Save role of ${member.name}`}>
              Save
            </Button>
          </form>
        ) : (
          ROLE_LABEL[member.role]
        )}
      </td>
      <td className="px-3 py-2">
        {(canManage || isSelf) &&
          (confirming ? (
            <div className="flex flex-wrap items-center gap-2">
              <span>{isSelf ? 'Leave this studio?' : `Remove ${member.name}?`}</span>
              <Button variant="danger" busy={remove.isPending} busyLabel="Working…" onClick={() => remove.mutate({ studioId, userId: member.userId })}>
                {isSelf ? 'Yes, leave' : 'Yes, remove'}
              </Button>
              <Button variant="quiet" onClick={() => setConfirming(false)}>
                Cancel
              </Button>
            </div>
          ) : (
            <Button variant="danger" onClick={() => setConfirming(true)} aria-label={isSelf ? removeLabel : `Remove ${member.name}`}>
              {removeLabel}
            </Button>
          ))}
        {error && (
          <div className="mt-2">
            <ErrorNotice title="Not changed" error={error} />
          </div>
        )}
      </td>
    </tr>
  );
}
