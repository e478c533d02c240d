import { useNavigate, useSearchParams } from 'react-router';
import { ErrorAlert } from '../../components/ui/alert';
import { TextLink } from '../../components/ui/text-link';
import { AuthLayout } from '../../features/auth/components/auth-layout';
import { ResetPasswordForm } from '../../features/auth/components/reset-password-form';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { paths } from '../../lib/paths';

/** Serves both the first-use invitation link and the password-reset link. */
export function ResetPasswordRoute() {
  useDocumentTitle('Choose a password');
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';

  return (
    <AuthLayout title="Choose a password" intro="Set the password you will sign in to Beadloom with.">
      {token ? (
        <ResetPasswordForm
          token={token}
          onDone={(signedIn) =>
            signedIn ? navigate(paths.projects, { replace: true, state: { notice: 'Your password is set and you are signed in.' } }) : navigate(paths.signInPasswordSet, { replace: true })
          }
        />
      ) : (
        <ErrorAlert>This link is incomplete. Open the link from your e-mail again, or ask for a new one.</ErrorAlert>
      )}
      <p className="mt-5 text-center text-sm">
        <TextLink to={paths.forgotPassword}>Need a new link?</TextLink>
      </p>
    </AuthLayout>
  );
}
