import { PageHeader } from '../../components/ui/page-header';
import { DevInbox } from '../../features/mail/components/dev-inbox';

export function DevMailRoute() {
  return (
    <>
      <PageHeader
        title="Dev inbox"
        lead="Messages the local mail catcher received: invitations, password resets, comment and review mail. Nothing here left this machine."
      />
      <DevInbox />
    </>
  );
}
