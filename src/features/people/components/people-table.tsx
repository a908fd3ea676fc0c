import { ROLE_LABELS, ROLES, type Person } from '@shared/schemas/roles';
import { PersonRow } from './person-row';
import { RoleSourceTag } from './role-source';

/** Says what the small tags under each checkbox mean. */
export function RoleSourceLegend() {
  return (
    <ul className="flex flex-wrap items-center gap-x-5 gap-y-2 text-sm text-ink-soft">
      <li className="flex items-center gap-2">
        <RoleSourceTag source="directory" /> held through the plant directory
      </li>
      <li className="flex items-center gap-2">
        <RoleSourceTag source="granted" /> added in Linewright
      </li>
      <li className="flex items-center gap-2">
        <RoleSourceTag source="withdrawn" /> the directory gives it, Linewright takes it away
      </li>
    </ul>
  );
}

export function PeopleTable({ people, meId }: { people: Person[]; meId: string }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full min-w-[900px] border-collapse">
        <caption className="sr-only">People and the roles they hold</caption>
        <thead>
          <tr className="text-left align-bottom text-sm font-semibold leading-tight text-ink-soft">
            <th scope="col" className="px-3 pb-2">
              Person
            </th>
            <th scope="col" className="w-28 px-3 pb-2">
              Last sign-in
            </th>
            {ROLES.map((role) => (
              <th key={role} scope="col" className="w-24 px-1 pb-2 text-center">
                {ROLE_LABELS[role]}
              </th>
            ))}
            <th scope="col" className="w-28 px-3 pb-2">
              <span className="sr-only">Save</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {people.map((p) => (
            <PersonRow key={p.id} person={p} isMe={p.id === meId} />
          ))}
        </tbody>
      </table>
    </div>
  );
}
