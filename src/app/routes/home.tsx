import type { User } from '@shared/schemas/auth';
import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { useMe } from '@/features/auth/api/session';
import { takesQueryOptions } from '@/features/history/api/takes';
import { studiosQueryOptions } from '@/features/studios/api/studios';
import { MyAssignments } from '@/features/studios/components/my-assignments';
import { NotificationList } from '@/features/studios/components/notification-list';
import { StudioSummary } from '@/features/studios/components/studio-summary';
import { WhatNext } from '@/features/maps/components/what-next';

function NextStep({ to, title, text }: { to: string; title: string; text: string }) {
  return (
    <Link to={to} className="group block rounded-card border border-line bg-raised p-5 hover:border-brass-500">
      <span className="block text-lead font-bold group-hover:text-brass-700 dark:group-hover:text-brass-300">
        {title} →
      </span>
      <span className="mt-1 block text-muted">{text}</span>
    </Link>
  );
}

function PlayerHome() {
  return (
    <>
      <div className="grid gap-3 md:grid-cols-2">
        <NextStep
          to="/drills"
          title="Find a pair"
          text="Type the chord you're soloing over; pick a pair whose six notes fit it and a pattern to drill."
        />
        <NextStep
          to="/practice"
          title="Practise"
          text="Plug in your keyboard or wind controller, take the count-in, and play the drill through the key cycle."
        />
      </div>
      <h2 className="mt-8 text-lead font-bold">What next</h2>
      <WhatNext />
      <p className="mt-2 text-caption text-muted">
        From your{' '}
        <Link to="/progress" className="underline">
          key, range and beat maps
        </Link>{' '}
        and your{' '}
        <Link to="/history" className="underline">
          takes
        </Link>
        .
      </p>
      <h2 className="mt-8 text-lead font-bold">Assignments</h2>
      <MyAssignments />
      <h2 className="mt-8 text-lead font-bold">Your studio</h2>
      <StudioSummary empty="You're not in a studio yet; when a teacher adds you, their assignments show up here." />
    </>
  );
}

function TeacherHome() {
  return (
    <>
      <div className="grid gap-3 md:grid-cols-2">
        <NextStep
          to="/studio"
          title="Open your studio"
          text="See your players, set this week's assignments, and leave remarks on their takes."
        />
      </div>
      <h2 className="mt-8 text-lead font-bold">Your studio</h2>
      <StudioSummary empty="You have no studio yet; create one from the studio page and invite your players." />
    </>
  );
}

function AdminHome() {
  return (
    <div className="grid gap-3 md:grid-cols-2">
      <NextStep
        to="/admin/users"
        title="Review accounts"
        text="Everyone on this Sixfold: players, teachers and admins, and whose account is switched off."
      />
    </div>
  );
}

const lead: Record<User['role'], string> = {
  player: 'Next: pick a pair, then play it through the keys.',
  teacher: 'Next: check in on your players and set the week’s drills.',
  admin: 'Next: keep the accounts on this Sixfold in order.',
};

/**
 * "Welcome back" only to someone who has been here before: a player with a take, a teacher with
 * a studio. A brand-new account (or one still loading) is simply welcomed.
 */
function Greeting({ user }: { user: User }) {
  const takes = useQuery({ ...takesQueryOptions({ pageSize: 1 }), enabled: user.role === 'player' });
  const studios = useQuery({ ...studiosQueryOptions, enabled: user.role === 'teacher' });
  const first = user.name.split(/\s+/)[0];
  const returning =
    user.role === 'player'
      ? (takes.data?.total ?? 0) > 0
      : user.role === 'teacher'
        ? (studios.data?.studios.length ?? 0) > 0
        : false;
  return (
    <h1 className="mt-1 text-display" data-testid="home-greeting">
      {returning ? `Welcome back, ${first}.` : `Welcome to Sixfold, ${first}.`}
    </h1>
  );
}

/** What to do next, per role. */
export function HomeRoute() {
  const { user } = useMe();
  if (!user) return null;
  return (
    <section className="grid gap-6" data-testid={`home-${user.role}`}>
      <header>
        <p className="text-caption font-bold uppercase tracking-[0.2em] text-brass-700 dark:text-brass-300">
          {user.role} home
        </p>
        <Greeting user={user} />
        <p className="mt-2 text-lead text-muted">{lead[user.role]}</p>
      </header>
      <NotificationList />
      <div>{user.role === 'player' ? <PlayerHome /> : user.role === 'teacher' ? <TeacherHome /> : <AdminHome />}</div>
    </section>
  );
}
