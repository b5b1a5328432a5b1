import path from 'node:path';
import { z } from 'zod';
import { startFakeMail } from './server';

const PortSchema = z.coerce.number().int().min(0).max(65535);

const EnvSchema = z.object({
  FAKE_MAIL_SMTP_PORT: PortSchema.default(2525),
  FAKE_MAIL_HTTP_PORT: PortSchema.default(8025),
  FAKE_MAIL_DIR: z.string().min(1).default('.data/mail'),
});

/** Runs the test inbox until SIGINT or SIGTERM. */
export async function main(): Promise<void> {
  const env = EnvSchema.safeParse(process.env);
  if (!env.success) {
    console.error(`[fake-mail] bad environment: ${z.prettifyError(env.error)}`);
    process.exitCode = 1;
    return;
  }
  const dir = path.resolve(process.cwd(), env.data.FAKE_MAIL_DIR);
  const mail = await startFakeMail({
    smtpPort: env.data.FAKE_MAIL_SMTP_PORT,
    httpPort: env.data.FAKE_MAIL_HTTP_PORT,
    dir,
  });
  console.log(`[fake-mail] SMTP  ${mail.smtpUrl}`);
  console.log(`[fake-mail] inbox ${mail.url}`);
  console.log(`[fake-mail] messages kept in ${dir}`);

  const stop = (signal: NodeJS.Signals) => {
    console.log(`[fake-mail] ${signal}, stopping`);
    mail.close().then(
      () => process.exit(0),
      (err: unknown) => {
        console.error('[fake-mail] error while stopping:', err);
        process.exit(1);
      },
    );
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}

main().catch((err: unknown) => {
  console.error('[fake-mail] could not start:', err instanceof Error ? err.message : err);
  process.exitCode = 1;
});
