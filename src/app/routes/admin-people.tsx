import { useQuery } from '@tanstack/react-query';
import { Card, PageHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { authQueries, useMe } from '@/lib/auth';
import { peopleQueries } from '@/features/people/api';
import { PeopleTable, RoleSourceLegend } from '@/features/people/components/people-table';
import { ensureOrShowRefusal } from '@/lib/loaders';
import { queryClient } from '@/lib/query-client';
import { may, refusalFor, whoMay } from '@shared/permissions';

// Someone who may not manage people is told so on the page itself, in the shell; the server has
// the last word (a 403 is shown the same way).
export async function loader() {
  const me = await queryClient.ensureQueryData(authQueries.me());
  return may(me, 'people.manage') ? ensureOrShowRefusal(peopleQueries.list()) : null;
}

export default function AdminPeoplePage() {
  const me = useMe();
  const allowed = may(me, 'people.manage');
  const people = useQuery({ ...peopleQueries.list(), enabled: allowed });
  return (
    <>
      <PageHeader
        title="People & roles"
        subtitle={`Everyone who has signed in. Roles come from the plant directory; here ${whoMay('people.manage')} grants more or withdraws some. A change takes effect on the person's next request, without signing in again.`}
      />
      {!allowed ? (
        <Notice tone="refusal" title="People & roles cannot be shown">
          {refusalFor('people.manage', me.roles)}
        </Notice>
      ) : people.isError ? (
        <Notice tone="refusal" title="People & roles cannot be shown">
          {people.error.message}
        </Notice>
      ) : people.isPending ? (
        <p className="text-ink-soft">Loading people…</p>
      ) : (
        <Card title={`${people.data.length} ${people.data.length === 1 ? 'person' : 'people'}`} actions={<RoleSourceLegend />}>
          <PeopleTable people={people.data} meId={me.id} />
        </Card>
      )}
    </>
  );
}
