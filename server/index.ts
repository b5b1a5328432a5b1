import { loadConfig, type Config } from './config';
import { startServer } from './start-server';

// Production entry: everything comes from the environment (see README, "Configuration").
let config: Config;
try {
  config = loadConfig();
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
}
const server = await startServer(config);
console.log(`Tillwell is serving on ${server.url}`);
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => {
    server.stop().then(() => process.exit(0));
  });
}
