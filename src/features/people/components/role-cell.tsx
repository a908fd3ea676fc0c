import { ROLE_LABELS, type Person, type Role } from '@shared/schemas/roles';
import { roleSource, RoleSourceTag } from './role-source';

/** A role's checkbox with a touch target of at least 44 px, and a tag saying where the role would stand. */
export function RoleCell({ person, role, on, disabled, onChange }: { person: Person; role: Role; on: boolean; disabled: boolean; onChange: (on: boolean) => void }) {
  const changed = on !== person.roles.includes(role);
  return (
    <td className="px-1 py-1 text-center">
      <label
        className={`mx-auto flex min-h-14 min-w-11 cursor-pointer flex-col items-center justify-center gap-1 rounded-lg px-1 hover:bg-paper-sunk ${changed ? 'ring-2 ring-hold ring-inset' : ''}`}
      >
        <input
          type="checkbox"
          className="h-6 w-6 cursor-pointer accent-tide"
          checked={on}
          disabled={disabled}
          onChange={(e) => onChange(e.target.checked)}
          aria-label={`${ROLE_LABELS[role]}: ${person.name}`}
        />
        <RoleSourceTag source={roleSource(person, role, on)} />
      </label>
    </td>
  );
}
