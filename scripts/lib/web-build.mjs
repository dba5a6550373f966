// Builds the web app when its build is missing or older than any of its sources.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { run } from './processes.mjs';
import { log, rootDir } from './services.mjs';

const webDir = join(rootDir, 'apps', 'web');
export const webDist = join(webDir, 'dist');

function newestMtime(path) {
  if (!existsSync(path)) return 0;
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(path)) {
    if (entry === 'node_modules' || entry === 'dist' || entry.startsWith('.')) continue;
    newest = Math.max(newest, newestMtime(join(path, entry)));
  }
  return newest;
}

export function webBuildIsStale() {
  const builtIndex = join(webDist, 'index.html');
  if (!existsSync(builtIndex)) return true;
  const sources = [
    join(webDir, 'src'),
    join(webDir, 'index.html'),
    join(webDir, 'vite.config.ts'),
    join(webDir, 'package.json'),
    join(webDir, 'public'),
    join(rootDir, 'packages', 'shared', 'src'),
    join(rootDir, 'packages', 'calc', 'src'),
  ];
  return Math.max(...sources.map(newestMtime)) > statSync(builtIndex).mtimeMs;
}

export async function buildWebIfStale() {
  if (!webBuildIsStale()) return;
  log('building the web app');
  const { code } = await run('npm', ['run', 'build', '-w', 'apps/web'], {
    cwd: rootDir,
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  if (code !== 0) throw new Error('the web app did not build');
}
