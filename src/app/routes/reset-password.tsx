import { Link, useSearchParams } from 'react-router-dom';
import { FormMessage } from '@/components/ui/form-message';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form';
import { AuthPage } from './auth-page';

export function ResetPasswordRoute() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  return (
    <AuthPage eyebrow="Password" title="Choose a new password">
      {token ? (
        <ResetPasswordForm token={token} />
      ) : (
        <FormMessage tone="error">
          This page needs the link from your e-mail.{' '}
          <Link to="/forgot-password" className="underline">
            Ask for a link
          </Link>
        </FormMessage>
      )}
    </AuthPage>
  );
}
