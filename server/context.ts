import type pg from 'pg';
import type { DestinationStream } from 'pino';
import type { Db } from './db/client';
import type { Env } from './env';
import type { Mailer } from './mail/mailer';

/** What the app is built from: the database, the parsed environment, and the mail adapter. */
export interface AppDeps {
  db: Db;
  pool: pg.Pool;
  env: Env;
  /** defaults to SMTP as the environment says */
  mailer?: Mailer;
  /** where request logs go (default stdout); tests read them */
  logStream?: DestinationStream;
}

/** What every router receives: the deps with the mailer settled. */
export type AppContext = AppDeps & { mailer: Mailer };
