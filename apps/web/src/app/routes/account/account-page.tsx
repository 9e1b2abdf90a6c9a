import { roleLabels, roleSummaries } from '@heatfleet/domain';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { useSignedInMe } from '@/lib/auth';
import { ChangePasswordForm } from '@/features/auth/components/change-password-form';
import { FirmList } from '@/features/firms/components/firm-list';

/** The signed-in person's own things: their role, their firms, their password. */
export function AccountPage() {
  const me = useSignedInMe();
  return (
    <>
      <PageHeader title="Your account">
        {me.user.name} ({me.user.email})
      </PageHeader>
      <div className="grid gap-5 lg:grid-cols-2">
        <Card title={`Your role: ${roleLabels[me.role]}`}>
          <p>{roleSummaries[me.role]}</p>
        </Card>
        <Card
          title="Your firms"
          description={me.memberships.length > 1 ? 'Switch to work in another firm.' : undefined}
        >
          <FirmList me={me} />
        </Card>
        <Card
          title="Change your password"
          description="Other devices signed in as you are signed out when you change it."
        >
          <ChangePasswordForm email={me.user.email} />
        </Card>
      </div>
    </>
  );
}
