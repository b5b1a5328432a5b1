import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

/** Installs Debian's chromium when it is missing and we are root; otherwise says what to install. */
export function ensureChromium(): void {
  if (fs.existsSync(CHROMIUM)) return;
  const root = process.getuid?.() === 0;
  const hasApt = spawnSync('sh', ['-c', 'command -v apt-get']).status === 0;
  if (!root || !hasApt) {
    throw new Error(`Chromium was not found at ${CHROMIUM}. Install Debian's "chromium" package (apt-get install chromium).`);
  }
  console.log('Installing Debian\'s chromium for the browser tests (once)…');
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
  execFileSync('apt-get', ['install', '-y', '-qq', 'chromium'], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}
