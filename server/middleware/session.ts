import session from 'express-session';
import MySQLStoreFactory from 'express-mysql-session';
import type { RequestHandler } from 'express';
import type { AppContext } from '../context';

export const SESSION_COOKIE = 'rindwise.sid';
const THIRTY_DAYS_MS = 30 * 24 * 60 * 60 * 1000;

/**
 * express-session with the MariaDB store on the app's pool (the table comes from our
 * migrations). Cookie: HttpOnly, SameSite=Lax, Secure when served over HTTPS.
 */
export function sessionMiddleware(ctx: AppContext): {
  handler: RequestHandler;
  close: () => Promise<void>;
} {
  const MySQLStore = MySQLStoreFactory(session);
  const store = new MySQLStore(
    {
      createDatabaseTable: false,
      clearExpired: true,
      checkExpirationInterval: 15 * 60 * 1000,
      expiration: THIRTY_DAYS_MS,
      endConnectionOnClose: false,
      schema: {
        tableName: 'sessions',
        columnNames: { session_id: 'session_id', expires: 'expires', data: 'data' },
      },
    },
    // The store accepts a mysql2/promise pool: one pool for the whole app.
    ctx.database.pool as unknown as ConstructorParameters<typeof MySQLStore>[1],
  );
  const handler = session({
    name: SESSION_COOKIE,
    secret: ctx.config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: ctx.config.trustProxy !== false,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: ctx.config.secureCookies,
      maxAge: THIRTY_DAYS_MS,
      path: '/',
    },
  });
  return { handler, close: () => store.close() };
}
