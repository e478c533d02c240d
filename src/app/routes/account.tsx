import { useNavigate } from 'react-router';
import { Button } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { Section } from '../../components/ui/section';
import { ChangePasswordForm } from '../../features/account/components/change-password-form';
import { DisplayNameForm } from '../../features/account/components/display-name-form';
import { useLogout } from '../../features/auth/api/logout';
import { EmailPreferencesForm } from '../../features/notifications/components/email-preferences-form';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { paths } from '../../lib/paths';
import { useCurrentUser } from '../../lib/auth';

export function AccountRoute() {
  useDocumentTitle('Your account');
  const me = useCurrentUser();
  const navigate = useNavigate();
  const logout = useLogout({ onSettled: () => navigate(paths.signIn, { replace: true }) });

  return (
    <>
      <PageHeader title="Your account" description={me.email} />
      <div className="flex flex-col gap-6">
        <Section title="Profile">
          <DisplayNameForm me={me} />
        </Section>
        <Section title="E-mail notifications" description="Mentions and replies on bead threads.">
          <EmailPreferencesForm />
        </Section>
        <Section title="Password">
          <ChangePasswordForm />
        </Section>
        <Section title="Session" description="Sign out of Beadloom in this browser.">
          <Button variant="secondary" pending={logout.isPending} pendingText="Signing out…" onClick={() => logout.mutate()}>
            Sign out of this browser
          </Button>
        </Section>
      </div>
    </>
  );
}
