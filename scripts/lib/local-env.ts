import fs from 'node:fs';
import path from 'node:path';
import { startFakeMail, type FakeMail } from '../../fake-mail/server';
import { startCluster, type Cluster } from './postgres';

export const root = path.resolve(import.meta.dirname, '..', '..');

export interface LocalServices {
  databaseUrl: string;
  mail: FakeMail | null;
  cluster: Cluster | null;
  stop(): Promise<void>;
}

/**
 * Starts what a developer machine needs: the project-local PostgreSQL cluster (unless
 * DATABASE_URL points elsewhere) and, when asked, the fake inbox.
 */
export async function startLocalServices(opts: { withMail: boolean }): Promise<LocalServices> {
  const dataRoot = process.env.TILLWELL_DATA_DIR ?? path.join(root, '.data');
  // The data folder is ours: keep it enterable so the postgres user can reach its cluster inside.
  fs.mkdirSync(dataRoot, { recursive: true });
  fs.chmodSync(dataRoot, fs.statSync(dataRoot).mode | 0o711);
  let cluster: Cluster | null = null;
  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    cluster = startCluster({
      dataDir: process.env.TILLWELL_PG_DIR ?? path.join(dataRoot, 'pg'),
      port: Number(process.env.TILLWELL_PG_PORT ?? 54329),
    });
    await cluster.createDatabase('tillwell');
    databaseUrl = cluster.url('tillwell');
  }
  let mail: FakeMail | null = null;
  try {
    if (opts.withMail) {
      mail = await startFakeMail({
        smtpPort: Number(process.env.FAKE_MAIL_SMTP_PORT ?? 2525),
        httpPort: Number(process.env.FAKE_MAIL_HTTP_PORT ?? 8025),
        dir: process.env.FAKE_MAIL_DIR ?? path.join(dataRoot, 'mail'),
      });
    }
  } catch (err) {
    cluster?.stop();
    throw err;
  }
  return {
    databaseUrl,
    mail,
    cluster,
    async stop() {
      await mail?.close();
      cluster?.stop();
    },
  };
}
