// Debian's chromium for browser tests: never a downloaded browser.
import type { LaunchOptions } from 'playwright-core';

/** Launch options for headless chromium on a closed network. */
export function launchOptions(): LaunchOptions {
  return {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  };
}
