import { lazy, Suspense } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { safeNext } from '@/features/auth/components/safe-next';
import { SignInPlaceholder } from '@/features/auth/components/sign-in-placeholder';
import { AuthPage } from './auth-page';

// Fetched as soon as this page's code runs, beside its first paint rather than before it.
const formModule = import('@/features/auth/components/sign-in-form');
const SignInForm = lazy(() => formModule.then((m) => ({ default: m.SignInForm })));

export function SignInRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  return (
    <AuthPage eyebrow="Welcome back" title="Sign in to Sixfold" lead="Pick up where your last take left off.">
      <Suspense fallback={<SignInPlaceholder />}>
        <SignInForm onSignedIn={() => navigate(safeNext(params.get('next')), { replace: true })} />
      </Suspense>
    </AuthPage>
  );
}
