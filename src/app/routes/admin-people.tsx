import { useQuery } from '@tanstack/react-query';
import { Card, PageHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { useMe } from '@/features/auth/api';
import { peopleQueries } from '@/features/people/api';
import { PeopleTable, RoleSourceLegend } from '@/features/people/components/people-table';
import { ApiRequestError } from '@/lib/api-client';
import { queryClient } from '@/lib/query-client';

/** A refusal (403) is shown on the page itself, in the shell; anything else goes to the route's error page. */
export async function loader() {
  try {
    await queryClient.ensureQueryData(peopleQueries.list());
  } catch (err) {
    if (!(err instanceof ApiRequestError && err.status === 403)) throw err;
  }
  return null;
}

export default function AdminPeoplePage() {
  const me = useMe();
  const people = useQuery(peopleQueries.list());
  return (
    <>
      <PageHeader
        title="People & roles"
        subtitle="Everyone who has signed in. Roles come from the plant directory; here an administrator grants more or withdraws some. A change takes effect on the person's next request, without signing in again."
      />
      {people.isError ? (
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
