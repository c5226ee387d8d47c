import { Card } from '@/components/ui/card';
import { useMe } from '@/features/auth/api/session';
import { AccountNameForm } from '@/features/auth/components/account-name-form';
import { ChangePasswordForm } from '@/features/auth/components/change-password-form';

export function AccountRoute() {
  const { user } = useMe();
  if (!user) return null;
  return (
    <section className="mx-auto grid max-w-xl gap-6">
      <h1 className="text-title">Account settings</h1>
      <Card>
        <h2 className="mb-4 text-lead font-bold">Name</h2>
        <AccountNameForm user={user} />
      </Card>
      <Card>
        <h2 className="mb-4 text-lead font-bold">Password</h2>
        <ChangePasswordForm />
      </Card>
    </section>
  );
}
