// Part of npm start: builds the app when there is no production build yet, or when the sources are newer
// than the build (so a fresh clone and a pulled change both just work).
import { execSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const root = process.cwd();
const buildId = path.join(root, process.env.NEXT_DIST_DIR || '.next', 'BUILD_ID');
const watched = ['app', 'components', 'lib', 'models', 'proxy.ts', 'instrumentation.ts', 'next.config.js', 'tailwind.config.ts', 'package-lock.json'];

function newest(p) {
  if (!fs.existsSync(p)) return 0;
  const st = fs.statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  let m = 0;
  for (const e of fs.readdirSync(p)) m = Math.max(m, newest(path.join(p, e)));
  return m;
}

const built = fs.existsSync(buildId) ? fs.statSync(buildId).mtimeMs : 0;
const changed = Math.max(...watched.map((w) => newest(path.join(root, w))));
if (!built || changed > built) {
  console.log(built ? '[thawline] sources changed since the last build: building…' : '[thawline] no build yet: building…');
  execSync('npx next build', { stdio: 'inherit' });
}
