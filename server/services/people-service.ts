import { sequelize } from '@server/db/sequelize';
import { Person } from '@server/db/models/person';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import { ROLES, type Fitter, type Me, type Person as PersonDto, type Role } from '@shared/schemas/roles';

/** What a person may do: the identity provider's roles, plus the admin's grants, less withdrawals. */
export function effectiveRoles(p: Pick<Person, 'rolesFromIdp' | 'rolesGranted' | 'rolesWithdrawn'>): Role[] {
  const held = new Set<Role>([...p.rolesFromIdp, ...p.rolesGranted]);
  for (const r of p.rolesWithdrawn) held.delete(r);
  return ROLES.filter((r) => held.has(r));
}

export function toMe(p: Pick<Person, 'id' | 'name' | 'email' | 'rolesFromIdp' | 'rolesGranted' | 'rolesWithdrawn'>): Me {
  return { id: p.id, name: p.name, email: p.email, roles: effectiveRoles(p) };
}

function toDto(p: Person): PersonDto {
  return {
    ...toMe(p),
    rolesFromIdentityProvider: p.rolesFromIdp,
    rolesGranted: p.rolesGranted,
    rolesWithdrawn: p.rolesWithdrawn,
    lastSignInAt: p.lastSignInAt?.toISOString() ?? null,
  };
}

export async function currentPerson(id: string): Promise<Me | null> {
  const p = await Person.findByPk(id);
  return p ? toMe(p) : null;
}

export interface SignInClaims {
  issuer: string;
  subject: string;
  name: string;
  email: string | null;
  roles: Role[];
}

/** Creates or refreshes the person behind a sign-in; roles from the provider are replaced each time. */
export async function recordSignIn(claims: SignInClaims): Promise<Me> {
  return sequelize.transaction(async (transaction) => {
    const [person, created] = await Person.findOrCreate({
      where: { issuer: claims.issuer, subject: claims.subject },
      defaults: { issuer: claims.issuer, subject: claims.subject, name: claims.name, email: claims.email, rolesFromIdp: claims.roles, lastSignInAt: new Date() },
      transaction,
    });
    if (!created) {
      await person.update({ name: claims.name, email: claims.email, rolesFromIdp: claims.roles, lastSignInAt: new Date() }, { transaction });
    }
    await recordAudit({ actorId: person.id, action: 'sign-in', entity: 'person', entityId: person.id, after: { roles: claims.roles } }, transaction);
    return toMe(person);
  });
}

/** Everyone who holds the fitter role now (the directory's, granted, less withdrawn), by name. */
export async function listFitters(): Promise<Fitter[]> {
  const people = await Person.findAll({ order: [['name', 'ASC']] });
  return people.filter((p) => effectiveRoles(p).includes('fitter')).map((p) => ({ id: p.id, name: p.name }));
}

export async function listPeople(): Promise<PersonDto[]> {
  const people = await Person.findAll({ order: [['name', 'ASC']] });
  return people.map(toDto);
}

/** Sets a person's roles as the admin wants them, kept as grants and withdrawals against the provider's. */
export async function setRoles(actor: Me, personId: string, wanted: Role[]): Promise<PersonDto> {
  return sequelize.transaction(async (transaction) => {
    const person = await Person.findByPk(personId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!person) throw AppError.notFound('No such person.');
    if (person.id === actor.id && !wanted.includes('admin')) {
      throw AppError.conflict('You cannot withdraw your own admin role; ask another admin.');
    }
    const before = effectiveRoles(person);
    const want = new Set(wanted);
    await person.update(
      {
        rolesGranted: ROLES.filter((r) => want.has(r) && !person.rolesFromIdp.includes(r)),
        rolesWithdrawn: ROLES.filter((r) => !want.has(r) && person.rolesFromIdp.includes(r)),
      },
      { transaction },
    );
    await recordAudit({ actorId: actor.id, action: 'roles-set', entity: 'person', entityId: person.id, before, after: effectiveRoles(person) }, transaction);
    return toDto(person);
  });
}
