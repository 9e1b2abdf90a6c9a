import { Link } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { paths } from '@/config/paths';
import { PageHeader } from '@/components/ui/page-header';
import { Can } from '@/lib/ability';
import { useSignedInMe } from '@/lib/auth';
import { FirmSettingsForm } from '@/features/firms/components/firm-settings-form';
import { ItemKindsEditor } from '@/features/kits/components/item-kinds-editor';
import { ReminderSettingsForm } from '@/features/reminders/components/reminder-settings-form';
import { SuppressionList } from '@/features/reminders/components/suppression-list';

export function SettingsPage() {
  const me = useSignedInMe();
  return (
    <>
      <PageHeader title="Settings">
        {me.activeFirm.name}: the firm itself, how it inspects its kit and when it is reminded.
      </PageHeader>
      <div className="space-y-5">
        <Can I="update" a="Firm">
          <Card
            title="Firm"
            description="Name, address, time zone, units and the cold-bottom threshold of the radiator log."
          >
            <FirmSettingsForm />
          </Card>
        </Can>
        <Can I="update" a="PriceList">
          <Card title="Prices and VAT" description="The price list, VAT registration, payment terms and reminders.">
            <Link
              to={paths.prices.getHref()}
              className="inline-flex min-h-12 items-center font-semibold text-brand-700 underline"
            >
              Prices
            </Link>
          </Card>
        </Can>
        <Can I="read" a="PaymentAccount">
          <Card title="Card payments" description="The firm's own account for customers' card payments.">
            <Link
              to={paths.paymentSettings.getHref()}
              className="inline-flex min-h-12 items-center font-semibold text-brand-700 underline"
            >
              Payment account
            </Link>
          </Card>
        </Can>
        <Can I="update" a="ReminderSettings">
          <Card
            title="Reminders"
            description="One digest e-mail a day per firm, and one per engineer for their own van."
          >
            <ReminderSettingsForm timeZone={me.activeFirm.timeZone} />
          </Card>
          <Card
            title="Customers not sent offers"
            description="The yearly check e-mail offers a paid visit, so a customer can refuse it: by the link in each e-mail, or by asking the office. Nobody on this list is sent it again."
          >
            <SuppressionList timeZone={me.activeFirm.timeZone} />
          </Card>
        </Can>
        <Can I="update" a="ItemKind">
          <Card title="Item kinds and inspection rules">
            <ItemKindsEditor />
          </Card>
        </Can>
      </div>
    </>
  );
}
