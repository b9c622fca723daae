'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { ConfirmDanger } from '@/components/ui/confirm-danger';
import { apiFetch } from '@/lib/client/api';
import type { Role } from '@/lib/auth/roles';

/**
 * A member with their role select and Remove. The only owner can be neither demoted nor
 * removed (the server refuses with 409 too); the row says why instead of offering it.
 */
export function MemberRow({ member, isSelf, onlyOwner }: { member: { membershipId: number; email: string; name: string; role: Role }; isSelf: boolean; onlyOwner: boolean }) {
  const router = useRouter();
  const [role, setRole] = useState<Role>(member.role);
  const [asking, setAsking] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const reasonId = `only-owner-${member.membershipId}`;

  async function act(method: 'PATCH' | 'DELETE', body?: unknown) {
    setBusy(true);
    const res = await apiFetch(`/api/v1/team/members/${member.membershipId}`, { method, body });
    setBusy(false);
    if (!res.ok) {
      setError(res.problem.detail ?? res.problem.title);
      setRole(member.role); // the select shows the role the member still has
      return false;
    }
    setError(null);
    router.refresh();
    return true;
  }

  async function changeRole(next: Role) {
    setRole(next);
    await act('PATCH', { role: next });
  }

  async function remove() {
    if (await act('DELETE')) setAsking(false);
  }

  const question = isSelf
    ? 'Remove yourself from the organization? You lose access on your next request.'
    : `Remove ${member.email} from the organization? They lose access on their next request.`;

  return (
    <li className="flex flex-wrap items-center gap-3 border-t border-dusk-800 py-3" data-testid="member-row">
      <div className="min-w-0 flex-1 basis-48">
        <p className="font-bold">{member.name || member.email}{isSelf ? <span className="ml-2 text-xs text-ink-faint">(you)</span> : null}</p>
        <p className="break-words text-sm text-ink-muted">{member.email}</p>
      </div>
      <label className="sr-only" htmlFor={`role-${member.membershipId}`}>Role of {member.email}</label>
      <select id={`role-${member.membershipId}`} value={role} onChange={(e) => changeRole(e.target.value as Role)} disabled={onlyOwner || busy}
        aria-describedby={onlyOwner ? reasonId : undefined}
        className="rounded-md border border-dusk-600 bg-dusk-950 px-2 py-1.5 text-sm disabled:cursor-not-allowed disabled:opacity-60">
        <option value="owner">owner</option>
        <option value="deployer">deployer</option>
        <option value="viewer">viewer</option>
      </select>
      <button type="button" onClick={() => setAsking(true)} disabled={onlyOwner || asking} aria-describedby={onlyOwner ? reasonId : undefined}
        className="rounded-md border border-dusk-600 px-3 py-1.5 text-sm hover:bg-dusk-800 disabled:cursor-not-allowed disabled:opacity-60 disabled:hover:bg-transparent" data-testid="member-remove">
        Remove
      </button>
      {onlyOwner ? <p id={reasonId} className="w-full text-xs text-ink-faint" data-testid="member-only-owner">The only owner: make another member owner first.</p> : null}
      {asking ? (
        <div className="w-full">
          <ConfirmDanger label={`Confirm removing ${member.email}`} question={question} confirm="Remove now" busy={busy}
            onConfirm={remove} onCancel={() => { setAsking(false); setError(null); }} testId="member-remove-confirm" />
        </div>
      ) : null}
      {error ? <p className="w-full text-sm text-hazard" role="alert">{error}</p> : null}
    </li>
  );
}
