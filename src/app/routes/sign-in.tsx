import { useNavigate, useSearchParams } from 'react-router-dom';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { safeNext } from '@/features/auth/components/safe-next';
import { AuthPage } from './auth-page';

export function SignInRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  return (
    <AuthPage eyebrow="Welcome back" title="Sign in to Sixfold" lead="Pick up where your last take left off.">
      <SignInForm onSignedIn={() => navigate(safeNext(params.get('next')), { replace: true })} />
    </AuthPage>
  );
}
