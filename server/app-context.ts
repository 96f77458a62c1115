// What every router and middleware is built from: one object, made by main.ts or a test.
import type { BackgroundWork } from './background-work';
import type { Config } from './config';
import type { Db, Sqlite } from './db/database';
import type { Logger } from './logger';
import type { Mailer } from './mail/mailer';

export interface AppContext {
  config: Config;
  /** Signing secret of session JWTs, resolved once (see resolveJwtSecret). */
  jwtSecret: string;
  db: Db;
  sqlite: Sqlite;
  mailer: Mailer;
  logger: Logger;
  /** Jobs run after the answer (server/background-work.ts). */
  background: BackgroundWork;
}
