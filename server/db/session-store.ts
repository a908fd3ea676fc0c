// The session store: connect-pg-simple's, except that reading a session also reads the person it
// belongs to and makes the request's freshness check (server/db/change-log.ts), in the same
// statement. The roles are read fresh on every request: a role withdrawn by an admin (in this
// process or another) ends on the person's next request.
//
// Reads are batched: while one session read is on its way, the requests that arrive wait for it to
// come back and then go together in the next one (`sid = any(…)`). A request alone pays one round
// trip as before; fifty at once pay a handful, and each is still read after it arrived, so it
// still sees every change committed before it.

import connectPgSimple from 'connect-pg-simple';
import session, { type SessionData } from 'express-session';
import type { Request } from 'express';
import DataLoader from 'dataloader';
import pg from 'pg';
import { applyFreshness, checkSnapshot, freshnessColumns, type ChangeView } from '@server/db/change-log';
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
      /** The freshness check made with this GET's session read; absent on other methods (their own writes come after it). */
      changeView?: ChangeView;
    }
  }
}

// A symbol-keyed property is neither copied into req.session, nor hashed (so it never makes the
// session look changed), nor stored: it only carries the row from get() to createSession().
const PERSON = Symbol('sessionPerson');
const VIEW = Symbol('changeView');
type Loaded = SessionData & { [PERSON]?: SessionPerson | null; [VIEW]?: ChangeView };

const READ = `
  select c.snapshot, c.changed, x.*
    from (select ${freshnessColumns('$2')}) c
    left join lateral (
      select s.sid, s.sess::text as sess, p.id, p.name, p.email, p.roles_from_idp as "rolesFromIdp", p.roles_granted as "rolesGranted",
             p.roles_withdrawn as "rolesWithdrawn"
        from user_sessions s
        left join people p on p.id = case when s.sess->>'personId' ~ '^[0-9a-f-]{36}$' then (s.sess->>'personId')::uuid end
       where s.sid = any($1::text[]) and s.expire >= now()) x on true`;

type Row = { snapshot: string; changed: string[] | null; sid: string | null; sess: string } & Partial<SessionPerson>;
type Read = { row: Row | undefined; view: ChangeView };

/** The batch size at most; more waiting requests go in the next read. */
const MAX_BATCH = 200;

let readsSent = 0;
let sessionsRead = 0;
/** Session reads sent to PostgreSQL by this process, and the sessions they asked for (the bench prints their ratio). */
export function sessionReadCounts(): { reads: number; sessions: number } {
  return { reads: readsSent, sessions: sessionsRead };
}

export class SessionStore extends PgStore {
  readonly #pool: pg.Pool;
  #reading = false;
  #next: (() => void) | undefined;
  readonly #reads = new DataLoader<string, Read>((sids) => this.#read(sids), {
    cache: false,
    maxBatchSize: MAX_BATCH,
    // One read on its way at a time: a batch opened meanwhile goes when it is back.
    batchScheduleFn: (dispatch) => {
      if (this.#reading) this.#next = dispatch;
      else process.nextTick(dispatch);
    },
  });

  constructor(databaseUrl: string) {
    const pool = new pg.Pool({ connectionString: databaseUrl, max: 10 });
    // Expiry is extended by the session middleware at most every few minutes (a save), never by a
    // write on every request.
    super({ pool, tableName: 'user_sessions', createTableIfMissing: false, disableTouch: true });
    this.#pool = pool;
  }

  async #read(sids: readonly string[]): Promise<Read[]> {
    this.#reading = true;
    readsSent += 1;
    sessionsRead += sids.length;
    try {
      const sentWith = checkSnapshot();
      const { rows } = await this.#pool.query<Row>(READ, [sids, sentWith]);
      const view = applyFreshness(sentWith, rows[0]!);
      const bySid = new Map(rows.filter((r) => r.sid !== null).map((r) => [r.sid!, r]));
      return sids.map((sid) => ({ row: bySid.get(sid), view }));
    } finally {
      this.#reading = false;
      const next = this.#next;
      this.#next = undefined;
      next?.();
    }
  }

  override get(sid: string, callback: (err: unknown, session?: SessionData | null) => void): void {
    this.#reads.load(sid).then(
      ({ row, view }) => {
        if (!row) return callback(null, null);
        // Parsed per request from the text (requests of one batch may share a row): express-session
        // changes the object it is given.
        const sess: Loaded = JSON.parse(row.sess) as SessionData;
        sess[PERSON] = row.id
          ? { id: row.id, name: row.name!, email: row.email ?? null, rolesFromIdp: row.rolesFromIdp!, rolesGranted: row.rolesGranted!, rolesWithdrawn: row.rolesWithdrawn! }
          : null;
        sess[VIEW] = view;
        callback(null, sess);
      },
      (err: unknown) => callback(err),
    );
  }

  override createSession(req: Request, data: SessionData) {
    const loaded = data as Loaded;
    req.sessionPerson = loaded[PERSON] ?? null;
    if (req.method === 'GET' || req.method === 'HEAD') req.changeView = loaded[VIEW];
    return super.createSession(req, data);
  }

  override close(): Promise<void> {
    super.close();
    return this.#pool.end();
  }
}
