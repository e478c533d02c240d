import { TextLink } from '../../components/ui/text-link';
import { AuthLayout } from '../../features/auth/components/auth-layout';
import { ForgotPasswordForm } from '../../features/auth/components/forgot-password-form';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { paths } from '../../lib/paths';

export function ForgotPasswordRoute() {
  useDocumentTitle('Forgot password');
  return (
    <AuthLayout title="Forgot your password?" intro="Give us your address and we will e-mail you a link to choose a new one.">
      <ForgotPasswordForm />
      <p className="mt-5 text-center text-sm">
        <TextLink to={paths.signIn}>Back to sign in</TextLink>
      </p>
    </AuthLayout>
  );
}
