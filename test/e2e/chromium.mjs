// Debian's Chromium (and poppler-utils, which the print tests read PDFs with) for the end-to-end tests:
// found, or installed with apt-get when running as root; otherwise the run stops and says how to install them.
import { existsSync } from 'node:fs';
import { delimiter, join } from 'node:path';
import { execFileSync } from 'node:child_process';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const CHROMIUM_ARGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
];

/** The poppler programs the print tests call. */
const POPPLER = ['pdfinfo', 'pdftotext', 'pdftoppm'];

const onPath = (command) => (process.env.PATH ?? '').split(delimiter).some((dir) => dir !== '' && existsSync(join(dir, command)));

/** The Debian packages the end-to-end tests need that this machine lacks. */
function missingPackages() {
  const need = [];
  if (!existsSync(CHROMIUM_PATH)) need.push('chromium', 'fonts-liberation');
  if (POPPLER.some((c) => !onPath(c))) need.push('poppler-utils');
  return need;
}

/** Make sure Chromium and poppler-utils are there; returns Chromium's path or throws with how to install them. */
export function ensureChromium() {
  const need = missingPackages();
  if (need.length === 0) return CHROMIUM_PATH;
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (!isRoot) {
    throw new Error(`Missing for the end-to-end tests: ${need.join(', ')}. Install Debian's packages as root: apt-get update && apt-get install -y ${need.join(' ')}${existsSync(CHROMIUM_PATH) ? '' : ' (or set CHROMIUM_PATH)'}.`);
  }
  process.stderr.write(`Missing for the end-to-end tests: ${need.join(', ')}; installing Debian's packages with apt-get…\n`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...need], { stdio: 'inherit', env });
  const still = missingPackages();
  if (still.length > 0) throw new Error(`apt-get ran but ${still.join(', ')} ${still.length === 1 ? 'is' : 'are'} still missing`);
  return CHROMIUM_PATH;
}
