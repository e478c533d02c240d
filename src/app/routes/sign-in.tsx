import { useNavigate, useSearchParams } from 'react-router';
import { Notice } from '../../components/ui/alert';
import { AuthLayout } from '../../features/auth/components/auth-layout';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { safeNext } from '../../lib/paths';

export function SignInRoute() {
  useDocumentTitle('Sign in');
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const passwordSet = params.get('password') === 'set';

  return (
    <AuthLayout title="Sign in" intro="Welcome back to your group's mappings.">
      {passwordSet && (
        <div className="mb-4">
          <Notice>Your password is set. Sign in with it now.</Notice>
        </div>
      )}
      <SignInForm onSignedIn={() => navigate(safeNext(params.get('next')), { replace: true })} />
    </AuthLayout>
  );
}
