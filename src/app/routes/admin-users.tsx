import { PageHeader } from '../../components/ui/page-header';
import { Section } from '../../components/ui/section';
import { CreateUserForm } from '../../features/users/components/create-user-form';
import { UserTable } from '../../features/users/components/user-table';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { useCurrentUser } from '../../lib/auth';

export function AdminUsersRoute() {
  useDocumentTitle('Users');
  // The loader answered 404 to anyone but a site admin.
  const me = useCurrentUser();

  return (
    <>
      <PageHeader title="Users" description="Everyone with a Beadloom account on this site." />
      <div className="flex flex-col gap-6">
        <Section title="Create an account" description="The person receives an e-mail with a link to set their password.">
          <CreateUserForm />
        </Section>
        <Section title="Accounts">
          <UserTable currentUserId={me.id} />
        </Section>
      </div>
    </>
  );
}
