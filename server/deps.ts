import type { Knex } from 'knex';
import type { DestinationStream } from 'pino';
import type { Config } from './config';
import type { Mailer } from './mail/mailer';
import type { Storage } from './storage';

/** What every router and job needs: the database, the mailer, the configuration and the upload store. */
export interface Deps {
  db: Knex;
  mailer: Mailer;
  config: Config;
  /** Where uploads are kept (`server/storage`). */
  storage: Storage;
  /** Where log lines go; standard output when left out (tests pass a stream to read them). */
  logDestination?: DestinationStream;
}

/** What createApp takes: the store may be left out, and is then the one the configuration names. */
export type AppDeps = Omit<Deps, 'storage'> & { storage?: Storage };
