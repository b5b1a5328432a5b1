import type { Knex } from 'knex';
import type { DestinationStream } from 'pino';
import type { Config } from './config';
import type { Mailer } from './mail/mailer';

/** What every router and job needs: the database, the mailer and the configuration. */
export interface Deps {
  db: Knex;
  mailer: Mailer;
  config: Config;
  /** Where the request log goes; tests pass a captured stream. Defaults to stdout. */
  logDestination?: DestinationStream;
}
