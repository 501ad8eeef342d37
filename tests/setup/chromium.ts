import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { chromium, type Browser } from 'playwright-core';

export const CHROMIUM_PATH = '/usr/bin/chromium';

/**
 * Debian's chromium for the browser tests: installed with apt when missing and we are root,
 * otherwise a failure that names the command to run. A missing browser never skips tests.
 */
export function ensureChromium(): string {
  if (existsSync(CHROMIUM_PATH)) return CHROMIUM_PATH;
  const root = typeof process.getuid === 'function' && process.getuid() === 0;
  const hasApt = spawnSync('sh', ['-c', 'command -v apt-get'], { stdio: 'ignore' }).status === 0;
  if (root && hasApt) {
    console.log('chromium not found: installing Debian package chromium (apt-get)...');
    const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
    for (const args of [['update'], ['install', '-y', 'chromium']]) {
      const r = spawnSync('apt-get', args, { stdio: 'inherit', env });
      if (r.status !== 0) break;
    }
    if (existsSync(CHROMIUM_PATH)) return CHROMIUM_PATH;
  }
  throw new Error('The browser tests need Debian\'s chromium. Install it with:\n\n    sudo apt-get update && sudo apt-get install -y chromium\n');
}

/**
 * Headless chromium with no background traffic (this machine has no network). Playwright gives each
 * launch a fresh, empty profile folder of its own.
 */
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: ensureChromium(),
    headless: true,
    args: [
      '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
      '--disable-background-networking', '--disable-component-update', '--disable-sync',
    ],
  });
}
