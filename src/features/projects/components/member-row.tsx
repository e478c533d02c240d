import { useRef, useState } from 'react';
import type { Member } from '../../../shared/projects';
import { PROJECT_ROLES, ROLE_LABELS, type ProjectRole } from '../../../shared/roles';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { controlClass } from '../../../components/ui/field';
import { useChangeMemberRole } from '../api/change-member-role';
import { useRemoveMember } from '../api/remove-member';
import { RoleBadge } from './role-badge';

interface MemberRowProps {
  projectId: number;
  member: Member;
  isSelf: boolean;
  canManage: boolean;
}

export function MemberRow({ projectId, member, isSelf, canManage }: MemberRowProps) {
  const changeRole = useChangeMemberRole(projectId);
  const remove = useRemoveMember(projectId);
  const [confirming, setConfirming] = useState(false);
  const removeButton = useRef<HTMLButtonElement>(null);
  // Keyboard users land back where they were when they step out of the question.
  const keep = () => {
    setConfirming(false);
    requestAnimationFrame(() => removeButton.current?.focus());
  };
  const name = member.displayName || member.email;
  const error = changeRole.error ?? remove.error;

  return (
    <li aria-label={name} className="py-3">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div className="min-w-0">
          <p className="font-semibold text-ink-900">
            {name} {isSelf && <span className="font-normal text-ink-600">(you)</span>}
          </p>
          <p className="truncate text-sm text-ink-600">{member.email}</p>
        </div>
        <div className="flex items-center gap-2">
          {!member.activated && <Badge tone="paper">Invited</Badge>}
          {canManage ? (
            <select
              aria-label={`Role of ${name}`}
              value={member.role}
              disabled={changeRole.isPending}
              onChange={(e) => changeRole.mutate({ userId: member.userId, role: e.target.value as ProjectRole })}
              className={`${controlClass} w-auto py-1 text-sm`}
            >
              {PROJECT_ROLES.map((role) => (
                <option key={role} value={role}>
                  {ROLE_LABELS[role]}
                </option>
              ))}
            </select>
          ) : (
            <RoleBadge role={member.role} />
          )}
          {canManage && !confirming && (
            <Button ref={removeButton} variant="danger" size="sm" aria-label={`Remove ${name}`} onClick={() => setConfirming(true)}>
              Remove
            </Button>
          )}
        </div>
      </div>
      {confirming && (
        <div className="mt-2 flex flex-wrap items-center gap-2 rounded-md bg-alert-50 px-3 py-2 text-sm text-alert-700">
          <span>Remove {name} from this project?</span>
          <Button
            variant="danger"
            size="sm"
            pending={remove.isPending}
            pendingText="Removing…"
            onClick={() => remove.mutate(member.userId, { onSettled: () => setConfirming(false) })}
          >
            Yes, remove
          </Button>
          <Button variant="ghost" size="sm" autoFocus onClick={keep}>
            Keep
          </Button>
        </div>
      )}
      {error && (
        <div className="mt-2">
          <ErrorAlert error={error} />
        </div>
      )}
    </li>
  );
}
