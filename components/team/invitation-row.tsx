'use client';

import { useRouter } from 'next/navigation';
import { ConfirmDanger } from '@/components/ui/confirm-danger';
import { useDangerAction } from '@/components/ui/use-danger-action';

/** One open invitation with Cancel and its inline confirmation; the link stops working at once. */
export function InvitationRow({ invitation, until }: { invitation: { id: number; email: string; role: string }; until: string }) {
  const router = useRouter();
  const { asking, setAsking, busy, error, setError, run } = useDangerAction(`/api/v1/team/invitations/${invitation.id}`);
  const cancel = () => run(() => { setAsking(false); router.refresh(); });

  return (
    <li className="flex flex-wrap items-center gap-3 border-t border-dusk-800 py-2" data-testid="invitation-row">
      <p className="min-w-0 flex-1 basis-48 break-words">
        {invitation.email} as {invitation.role}, until <span className="figures">{until}</span>
      </p>
      {asking ? (
        <div className="w-full">
          <ConfirmDanger label={`Confirm cancelling the invitation to ${invitation.email}`} question={`Cancel the invitation to ${invitation.email}? Its link stops working at once.`}
            confirm="Cancel invitation" busy={busy} onConfirm={cancel} onCancel={() => { setAsking(false); setError(null); }} testId="invitation-cancel-confirm" />
        </div>
      ) : (
        <button type="button" onClick={() => setAsking(true)} className="rounded-md border border-dusk-600 px-3 py-1.5 text-sm text-ink hover:bg-dusk-800" data-testid="invitation-cancel">
          Cancel
        </button>
      )}
      {error ? <p className="w-full text-sm text-hazard" role="alert">{error}</p> : null}
    </li>
  );
}
