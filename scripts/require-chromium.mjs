// Browser tests need Debian's Chromium; without it `npm test` stops here instead of skipping them.
import fs from 'node:fs';

const browser = process.env.TRAYCE_CHROMIUM ?? '/usr/bin/chromium';
if (!fs.existsSync(browser)) {
  console.error(`Chromium is missing at ${browser}: install it with "sudo apt-get install -y chromium" (or set TRAYCE_CHROMIUM), then run npm test again.`);
  process.exit(1);
}
