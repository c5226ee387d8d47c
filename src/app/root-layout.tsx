import type { Role } from '@shared/schemas/auth';
import { AppShell, type NavItem } from '@/components/layout/app-shell';
import { useMe } from '@/features/auth/api/session';
import { UserMenu } from '@/features/auth/components/user-menu';

/** Each role's places. */
const navByRole: Record<Role, NavItem[]> = {
  player: [
    { to: '/home', label: 'Home' },
    { to: '/drills', label: 'Drills' },
    { to: '/practice', label: 'Practice' },
    { to: '/history', label: 'History' },
    { to: '/progress', label: 'Progress' },
    { to: '/books', label: 'Books' },
  ],
  teacher: [
    { to: '/home', label: 'Home' },
    { to: '/studio', label: 'Studio' },
    { to: '/drills', label: 'Drills' },
    { to: '/books', label: 'Books' },
  ],
  admin: [
    { to: '/home', label: 'Home' },
    { to: '/admin/users', label: 'Users' },
    { to: '/admin/purchases', label: 'Purchases' },
    { to: '/admin/audit', label: 'Audit log' },
  ],
};

export function RootLayout() {
  const { user } = useMe();
  return <AppShell nav={user ? navByRole[user.role] : []} aside={<UserMenu />} />;
}
