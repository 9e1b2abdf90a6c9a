import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { Can } from '@/lib/ability';
import { useSignedInMe } from '@/lib/auth';
import { InviteForm } from '@/features/team/components/invite-form';
import { MembersTable } from '@/features/team/components/members-table';
import { PendingInvitations } from '@/features/team/components/pending-invitations';

export function TeamPage() {
  const me = useSignedInMe();
  const firmId = me.activeFirm.id;
  const timeZone = me.activeFirm.timeZone;
  return (
    <>
      <PageHeader title="Team">Everyone in {me.activeFirm.name} and what they can do.</PageHeader>
      <div className="space-y-5">
        <Can I="create" a="Invitation">
          <Card
            title="Invite someone"
            description="They get an e-mail with a link to join. The link works once and expires."
          >
            <InviteForm firmId={firmId} />
          </Card>
        </Can>
        <Card title="Members">
          <MembersTable firmId={firmId} timeZone={timeZone} currentUserId={me.user.id} />
        </Card>
        <Can I="read" a="Invitation">
          <Card title="Pending invitations">
            <PendingInvitations timeZone={timeZone} />
          </Card>
        </Can>
      </div>
    </>
  );
}
