import { main } from '../../src/cli/main';

/**
 * Runs the command line in this process (faster than a child process when a
 * test runs it many times), capturing what it writes to stdout and stderr.
 */
export async function runMain(args: string[]): Promise<{ status: number; stdout: string; stderr: string }> {
  let stdout = '', stderr = '';
  const out = process.stdout.write, err = process.stderr.write;
  process.stdout.write = ((s: string | Uint8Array) => { stdout += String(s); return true; }) as never;
  process.stderr.write = ((s: string | Uint8Array) => { stderr += String(s); return true; }) as never;
  try {
    return { status: await main(args), stdout, stderr };
  } finally {
    process.stdout.write = out;
    process.stderr.write = err;
  }
}
