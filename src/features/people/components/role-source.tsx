import type { Person, Role } from '@shared/schemas/roles';

export type RoleSource = 'directory' | 'granted' | 'withdrawn' | null;

/** Where a role would stand if `held` were saved: the server keeps only the difference from the directory. */
export function roleSource(person: Person, role: Role, held: boolean): RoleSource {
  const fromDirectory = person.rolesFromIdentityProvider.includes(role);
  if (held) return fromDirectory ? 'directory' : 'granted';
  return fromDirectory ? 'withdrawn' : null;
}

const TAGS: Record<Exclude<RoleSource, null>, { text: string; className: string }> = {
  directory: { text: 'directory', className: 'bg-paper-sunk text-ink-soft' },
  granted: { text: 'granted here', className: 'bg-tide-light text-tide-dark' },
  withdrawn: { text: 'withdrawn here', className: 'bg-refuse-light text-refuse line-through decoration-1' },
};

export function RoleSourceTag({ source }: { source: RoleSource }) {
  if (!source) return <span aria-hidden className="h-5" />;
  const tag = TAGS[source];
  return <span className={`whitespace-nowrap rounded px-1.5 text-xs font-medium leading-5 ${tag.className}`}>{tag.text}</span>;
}
