// Debian's chromium for browser tests: never a downloaded browser.
import { existsSync } from 'node:fs';
import type { LaunchOptions } from 'playwright-core';

/** Launch options for headless chromium on a closed network. */
export function launchOptions(): LaunchOptions {
  const executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
  // global-setup installs it as root; say plainly what is missing rather than a launcher's stack trace.
  if (!existsSync(executablePath)) {
    throw new Error(`Chromium is missing at ${executablePath}: run \`npm test\` as root once (it installs Debian's "chromium"), or \`sudo apt-get install -y --no-install-recommends chromium\`.`);
  }
  return {
    executablePath,
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  };
}
