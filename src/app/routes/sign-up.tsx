import { useNavigate } from 'react-router-dom';
import { SignUpForm } from '@/features/auth/components/sign-up-form';
import { AuthPage } from './auth-page';

export function SignUpRoute() {
  const navigate = useNavigate();
  return (
    <AuthPage
      eyebrow="New account"
      title="Join Sixfold"
      lead="Players drill pairs in every key; teachers run a studio of players."
    >
      <SignUpForm onSignedUp={() => navigate('/home', { replace: true })} />
    </AuthPage>
  );
}
