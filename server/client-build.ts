import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

const CLIENT_SOURCES = ['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'package-lock.json'];

function newestMtimeMs(path: string): number {
  if (!existsSync(path)) return 0;
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(path)) newest = Math.max(newest, newestMtimeMs(join(path, entry)));
  return newest;
}

/** True when dist/index.html is missing or older than any client source. */
export function isClientBuildStale(root: string, outDir = join(root, 'dist')): boolean {
  const built = join(outDir, 'index.html');
  if (!existsSync(built)) return true;
  const builtAt = statSync(built).mtimeMs;
  return CLIENT_SOURCES.some((p) => newestMtimeMs(join(root, p)) > builtAt);
}

/** Runs `vite build` into outDir; throws when it fails. */
export function buildClient(root: string, outDir = join(root, 'dist'), options: { quiet?: boolean } = {}): void {
  const vite = join(root, 'node_modules', '.bin', 'vite');
  const result = spawnSync(vite, ['build', '--outDir', outDir, '--emptyOutDir'], { cwd: root, stdio: options.quiet ? 'pipe' : 'inherit', encoding: 'utf8' });
  if (result.status !== 0) throw new Error(`vite build failed (exit ${result.status})\n${result.stderr ?? ''}`);
}
