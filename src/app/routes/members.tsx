import { toast } from 'sonner';
import { describeError } from '@/components/ui/form-errors';
import { PageHeader } from '@/components/ui/page';
import { useMembers } from '@/features/members/api/get-members';
import { InviteForm } from '@/features/members/components/invite-form';
import { MemberTable } from '@/features/members/components/member-table';
import { PendingInvitations } from '@/features/members/components/pending-invitations';
import { INVITE_LABELS } from '@/features/members/components/role-words';
import { useAgency } from '../use-agency';

export function MembersPage() {
  const { agencyId, me } = useAgency();
  const members = useMembers(agencyId);
  const onError = (e: Error) => toast.error(describeError(e, INVITE_LABELS));
  return (
    <div className="space-y-5">
      <PageHeader title="Members" caption="People with access to this agency, and their roles." />
      <InviteForm agencyId={agencyId} />
      <MemberTable agencyId={agencyId} members={members.data} myUserId={me?.user.id} onError={onError} />
      <PendingInvitations agencyId={agencyId} members={members.data} onError={onError} />
    </div>
  );
}
