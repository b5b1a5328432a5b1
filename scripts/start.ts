import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { loadConfig } from '../server/config';
import { createDb } from '../server/db/knex';
import { loadReferenceCrops } from '../server/services/reference-crops';
import { startServer, type RunningServer } from '../server/start-server';
import { roleWords } from '@shared/schemas/auth';
import { DEMO_PASSWORD, demoSignIns } from '../seeds/01-demo-club';
import { root, startLocalServices, type LocalServices } from './lib/local-env';

// `npm start` (built client) and `npm run dev` (Vite with hot reload): local Postgres,
// migrations, the demo seed on an empty database, the fake inbox and the server.
const dev = process.argv.includes('--dev');
const vite = path.join(root, 'node_modules', 'vite', 'bin', 'vite.js');

let services: LocalServices | null = null;
let server: RunningServer | null = null;
let viteChild: ChildProcess | null = null;
let stopping = false;

async function shutdown(code: number) {
  if (stopping) return;
  stopping = true;
  console.log('\nStopping Tillwell…');
  viteChild?.kill('SIGTERM');
  await server?.stop().catch((e) => console.error(e));
  await services?.stop().catch((e) => console.error(e));
  console.log('Stopped.');
  process.exit(code);
}
process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));

try {
  services = await startLocalServices({ withMail: true });
  process.env.DATABASE_URL = services.databaseUrl;
  if (services.mail) process.env.SMTP_URL ??= services.mail.smtpUrl;
  const config = loadConfig(process.env);

  const db = createDb(config.databaseUrl);
  try {
    await db.migrate.latest();
    const [{ count }] = await db('users').count({ count: '*' });
    if (Number(count) === 0) {
      console.log('Empty database: loading the demo data…');
      await db.seed.run();
    }
    // After the seed, which empties the clubs (and with them every crop row).
    await loadReferenceCrops(db);
  } finally {
    await db.destroy();
  }

  if (!dev) {
    console.log('Building the client…');
    const build = spawnSync(process.execPath, [vite, 'build', '--logLevel', 'warn'], { cwd: root, stdio: 'inherit' });
    if (build.status !== 0) throw new Error('The client build failed (see above).');
  }
  server = await startServer(config);

  let appUrl = server.url;
  if (dev) {
    const vitePort = Number(process.env.VITE_PORT ?? 5173);
    viteChild = spawn(process.execPath, [vite, '--port', String(vitePort)], {
      cwd: root,
      stdio: 'inherit',
      env: { ...process.env, PORT: String(config.port) },
    });
    appUrl = `http://127.0.0.1:${vitePort}`;
  }

  console.log(`
Tillwell is running.
  App:         ${appUrl}
  Fake inbox:  ${services.mail?.url ?? '(not started: SMTP_URL points elsewhere)'}
  Demo sign-ins (password for all: ${DEMO_PASSWORD}):
${demoSignIns().map((p) => `    ${p.email.padEnd(22)} ${roleWords(p.roles)}`).join('\n')}
Press Ctrl-C to stop everything.`);
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  await shutdown(1);
}
