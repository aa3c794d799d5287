/** Debian's chromium driven by playwright-core; never a downloaded browser. */
import { chromium, type Browser } from 'playwright-core';

export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium', args: CHROMIUM_ARGS });
}
