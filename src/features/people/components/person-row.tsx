import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useSetRoles } from '@/features/people/api';
import { formatDateTime } from '@/lib/format';
import { ROLES, type Person, type Role } from '@shared/schemas/roles';
import { RoleCell } from './role-cell';

// A long address breaks before the @ rather than inside a word.
const Email = ({ address }: { address: string }) => {
  const at = address.indexOf('@');
  return at > 0 ? <>{address.slice(0, at)}<wbr />{address.slice(at)}</> : <>{address}</>;
};
const sameRoles = (a: readonly Role[], b: readonly Role[]) => a.length === b.length && a.every((r) => b.includes(r));

function RowActions({ dirty, saving, saved, onSave, onUndo }: { dirty: boolean; saving: boolean; saved: boolean; onSave: () => void; onUndo: () => void }) {
  if (dirty) {
    return (
      <span className="flex flex-col items-stretch gap-1">
        <Button onClick={onSave} disabled={saving}>
          {saving ? 'Saving…' : 'Save'}
        </Button>
        <Button variant="ghost" onClick={onUndo} disabled={saving}>
          Undo
        </Button>
      </span>
    );
  }
  return saved ? (
    <span role="status" className="inline-flex min-h-11 items-center font-semibold text-tide">
      ✓ Saved
    </span>
  ) : null;
}

/** One person: a checkbox per role, changes held back until Save, the server's refusal shown under the row. */
export function PersonRow({ person, isMe }: { person: Person; isMe: boolean }) {
  const [draft, setDraft] = useState<Role[] | null>(null);
  const setRoles = useSetRoles();
  const held = draft ?? person.roles;
  const dirty = draft !== null && !sameRoles(draft, person.roles);

  const toggle = (role: Role, on: boolean) => {
    setRoles.reset();
    setDraft(ROLES.filter((r) => (r === role ? on : held.includes(r))));
  };
  const save = () => setRoles.mutate({ id: person.id, roles: held }, { onSuccess: () => setDraft(null) });
  const undo = () => (setRoles.reset(), setDraft(null));

  return (
    <>
      <tr className={`border-t border-ink/10 ${dirty ? 'bg-hold-light/40' : ''}`}>
        <th scope="row" className="px-3 py-2 text-left align-middle font-normal">
          <span className="block font-semibold text-ink">
            {person.name}
            {isMe && <span className="ml-2 rounded bg-ink px-1.5 py-0.5 text-xs font-medium text-paper">you</span>}
          </span>
          <span className="block text-sm break-words text-ink-soft">{person.email ? <Email address={person.email} /> : 'no e-mail from the directory'}</span>
        </th>
        <td className="px-3 py-2 text-sm text-ink-soft">{person.lastSignInAt ? formatDateTime(person.lastSignInAt) : 'never'}</td>
        {ROLES.map((role) => (
          <RoleCell key={role} person={person} role={role} on={held.includes(role)} disabled={setRoles.isPending} onChange={(on) => toggle(role, on)} />
        ))}
        <td className="px-3 py-2 text-right">
          <RowActions dirty={dirty} saving={setRoles.isPending} saved={setRoles.isSuccess} onSave={save} onUndo={undo} />
        </td>
      </tr>
      {setRoles.isError && (
        <tr>
          <td colSpan={ROLES.length + 3} className="px-3 pb-3">
            <Notice tone="refusal" title={`The roles of ${person.name} were not saved`}>
              {setRoles.error.message}
            </Notice>
          </td>
        </tr>
      )}
    </>
  );
}
