// The session store: connect-pg-simple's, except that reading a session also reads the person it
// belongs to, in the same statement. A signed-in request therefore costs one round trip to
// PostgreSQL, and the roles are still read fresh on every request: a role withdrawn by an admin
// (in this process or another) ends on the person's next request.

import connectPgSimple from 'connect-pg-simple';
import session, { type SessionData } from 'express-session';
import type { Request } from 'express';
import pg from 'pg';
import type { Role } from '@shared/schemas/roles';

const PgStore = connectPgSimple(session);

/** The person row as the session read returns it: the columns effectiveRoles needs, by model name. */
export interface SessionPerson {
  id: string;
  name: string;
  email: string | null;
  rolesFromIdp: Role[];
  rolesGranted: Role[];
  rolesWithdrawn: Role[];
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** The session's person, read with the session; undefined when the session did not come from the store. */
      sessionPerson?: SessionPerson | null;
    }
  }
}

// A symbol-keyed property is neither copied into req.session, nor hashed (so it never makes the
// session look changed), nor stored: it only carries the row from get() to createSession().
const PERSON = Symbol('sessionPerson');
type Loaded = SessionData & { [PERSON]?: SessionPerson | null };

const READ = `
  select s.sess, p.id, p.name, p.email, p.roles_from_idp as "rolesFromIdp", p.roles_granted as "rolesGranted",
         p.roles_withdrawn as "rolesWithdrawn"
    from user_sessions s
    left join people p on p.id = case when s.sess->>'personId' ~ '^[0-9a-f-]{36}$' then (s.sess->>'personId')::uuid end
   where s.sid = $1 and s.expire >= now()`;

export class SessionStore extends PgStore {
  readonly #pool: pg.Pool;

  constructor(databaseUrl: string) {
    const pool = new pg.Pool({ connectionString: databaseUrl, max: 10 });
    // Expiry is extended by the session middleware at most every few minutes (a save), never by a
    // write on every request.
    super({ pool, tableName: 'user_sessions', createTableIfMissing: false, disableTouch: true });
    this.#pool = pool;
  }

  override get(sid: string, callback: (err: unknown, session?: SessionData | null) => void): void {
    this.#pool.query<{ sess: SessionData } & Partial<SessionPerson>>(READ, [sid]).then(
      ({ rows: [row] }) => {
        if (!row) return callback(null, null);
        const sess: Loaded = typeof row.sess === 'string' ? (JSON.parse(row.sess) as SessionData) : row.sess;
        sess[PERSON] = row.id
          ? { id: row.id, name: row.name!, email: row.email ?? null, rolesFromIdp: row.rolesFromIdp!, rolesGranted: row.rolesGranted!, rolesWithdrawn: row.rolesWithdrawn! }
          : null;
        callback(null, sess);
      },
      (err: unknown) => callback(err),
    );
  }

  override createSession(req: Request, data: SessionData) {
    req.sessionPerson = (data as Loaded)[PERSON] ?? null;
    return super.createSession(req, data);
  }

  override close(): Promise<void> {
    super.close();
    return this.#pool.end();
  }
}
