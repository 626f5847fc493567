// Debian's Chromium for the real-browser tests: found, or installed with apt-get when running as root.
import { existsSync } from 'node:fs';
import { execFileSync } from 'node:child_process';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const CHROMIUM_ARGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
];

/** Make sure Chromium is there; returns its path or throws with how to install it. */
export function ensureChromium() {
  if (existsSync(CHROMIUM_PATH)) return CHROMIUM_PATH;
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (!isRoot) {
    throw new Error(`Chromium is missing at ${CHROMIUM_PATH}. Install Debian's package as root: apt-get update && apt-get install -y chromium fonts-liberation poppler-utils (or set CHROMIUM_PATH).`);
  }
  process.stderr.write('Chromium is missing: installing Debian\'s chromium package with apt-get…\n');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '-qq', '--no-install-recommends', 'chromium', 'fonts-liberation', 'poppler-utils'], { stdio: 'inherit', env });
  if (!existsSync(CHROMIUM_PATH)) throw new Error(`apt-get ran but ${CHROMIUM_PATH} is still missing`);
  return CHROMIUM_PATH;
}
