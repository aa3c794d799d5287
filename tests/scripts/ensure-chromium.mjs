// Browser tests drive Debian's chromium through playwright-core (never a downloaded browser).
// Finds it, installs it with apt-get when missing and running as root, or says what to do.
import { execSync } from 'node:child_process';
import fs from 'node:fs';

const path = process.env.CHROMIUM_PATH || '/usr/bin/chromium';

if (fs.existsSync(path)) process.exit(0);

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
if (!isRoot) {
  console.error(
    `Browser tests need Chromium at ${path}, which is missing.\n` +
      '  Install it with:  sudo apt-get update && sudo apt-get install -y chromium\n' +
      '  or point CHROMIUM_PATH at a Chromium or Chrome binary, then run npm test again.',
  );
  process.exit(1);
}

console.log(`Chromium not found at ${path}; installing Debian's chromium package (as root)…`);
try {
  execSync('apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium', { stdio: 'inherit' });
} catch {
  console.error('Installing chromium with apt-get failed; install it by hand (apt-get install -y chromium) and run npm test again.');
  process.exit(1);
}
if (!fs.existsSync(path)) {
  console.error(`apt-get finished but ${path} is still missing; set CHROMIUM_PATH to the browser binary.`);
  process.exit(1);
}
