import { loadConfig } from './config';
import { startServer } from './start-server';

// Production entry: everything comes from the environment (see README, "Configuration").
const config = loadConfig();
const server = await startServer(config);
console.log(`Tillwell is serving on ${server.url}`);
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => {
    server.stop().then(() => process.exit(0));
  });
}
