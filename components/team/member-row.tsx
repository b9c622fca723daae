'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { apiFetch } from '@/lib/client/api';
import type { Role } from '@/lib/auth/roles';

export function MemberRow({ member, isSelf }: { member: { membershipId: number; email: string; name: string; role: Role }; isSelf: boolean }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);

  async function act(method: 'PATCH' | 'DELETE', body?: unknown) {
    const res = await apiFetch(`/api/v1/team/members/${member.membershipId}`, { method, body });
    if (!res.ok) setError(res.problem.detail ?? res.problem.title);
    else {
      setError(null);
      router.refresh();
    }
  }

  return (
    <li className="flex flex-wrap items-center gap-3 border-t border-dusk-800 py-3" data-testid="member-row">
      <div className="min-w-0 flex-1 basis-48">
        <p className="font-bold">{member.name || member.email}{isSelf ? <span className="ml-2 text-xs text-ink-faint">(you)</span> : null}</p>
        <p className="text-sm text-ink-muted">{member.email}</p>
      </div>
      <label className="sr-only" htmlFor={`role-${member.membershipId}`}>Role of {member.email}</label>
      <select id={`role-${member.membershipId}`} defaultValue={member.role} onChange={(e) => act('PATCH', { role: e.target.value })} className="rounded-md border border-dusk-600 bg-dusk-950 px-2 py-1.5 text-sm">
        <option value="owner">owner</option>
        <option value="deployer">deployer</option>
        <option value="viewer">viewer</option>
      </select>
      <button type="button" onClick={() => { if (confirm(`Remove ${member.email} from the organization?`)) act('DELETE'); }} className="rounded-md border border-dusk-600 px-3 py-1.5 text-sm hover:bg-dusk-800">
        Remove
      </button>
      {error ? <p className="w-full text-sm text-hazard" role="alert">{error}</p> : null}
    </li>
  );
}
