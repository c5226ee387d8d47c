import { useMe } from '@/features/auth/api/session';
import { StudioList } from '@/features/studios/components/studio-list';

export function StudioListRoute() {
  const { user } = useMe();
  return (
    <section className="grid gap-4">
      <h1 className="text-title">Studios</h1>
      <StudioList canCreate={user?.role === 'teacher'} />
    </section>
  );
}
