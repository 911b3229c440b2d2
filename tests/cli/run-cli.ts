import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const BIN = join(__dirname, '..', '..', 'bin', 'spotloom.mjs');

/** Runs the real command line in a child process, as a user would. */
export function runCli(args: string[], env: NodeJS.ProcessEnv = {}) {
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8', env: { ...process.env, ...env }, timeout: 300_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

export function scratch(): string {
  return mkdtempSync(join(tmpdir(), 'spotloom-test-'));
}

export function writeFile(dir: string, name: string, text: string): string {
  const file = join(dir, name);
  writeFileSync(file, text);
  return file;
}
