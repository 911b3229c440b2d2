import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { request } from 'node:https';
import { createServer, type Server } from 'node:net';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { ROOT } from './support/build-once';

// `npm start` as a user runs it, with ports 3000 and 3001 already taken by
// other programs: it must serve on free ports, print the addresses it
// serves, and stop both servers when the npm process is stopped. The
// timeouts are guards against a hang, not measurements.
const { portIsFree } = await import(/* @vite-ignore */ pathToFileURL(join(ROOT, 'webpack.config.js')).href);
const held: Server[] = [];
let npm: ChildProcess | undefined;

/** Takes a port on both loopback addresses where this machine lets us (it may be taken already: so much the better). */
async function occupy(port: number): Promise<void> {
  for (const host of ['127.0.0.1', '::1']) {
    await new Promise<void>((resolve) => {
      const s = createServer();
      s.once('error', () => resolve());
      s.listen(port, host, () => { held.push(s); resolve(); });
    });
  }
}

/** Every process below `pid` now (Linux /proc). */
function descendants(pid: number): number[] {
  const parent = new Map<number, number>();
  for (const name of readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    try {
      const stat = readFileSync(`/proc/${name}/stat`, 'utf8');
      parent.set(Number(name), Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]));
    } catch { /* gone meanwhile */ }
  }
  const out: number[] = [];
  const walk = (p: number) => { for (const [child, pp] of parent) if (pp === p) { out.push(child); walk(child); } };
  walk(pid);
  return out;
}

const alive = (pid: number) => existsSync(`/proc/${pid}`) && !/^\S+ \(.*\) Z/.test(readFileSync(`/proc/${pid}/stat`, 'utf8'));

function get(url: string): Promise<{ status: number; body: string }> {
  return new Promise((resolve, reject) => {
    // the dev server's certificate is self-signed; this test only needs to see what it serves
    const req = request(url, { rejectUnauthorized: false, timeout: 170_000 }, (res) => {
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (c: string) => { body += c; });
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body }));
    });
    req.on('error', reject);
    req.end();
  });
}

afterAll(async () => {
  if (npm?.pid && alive(npm.pid)) npm.kill('SIGKILL');
  await Promise.all(held.splice(0).map((s) => new Promise((r) => s.close(r))));
});

describe('npm start with ports 3000 and 3001 taken', () => {
  it('serves the add-in and the preview on free ports, prints those addresses, and stops both with the npm process', async () => {
    await occupy(3000);
    await occupy(3001);
    expect(await portIsFree(3000)).toBe(false);
    expect(await portIsFree(3001)).toBe(false);

    npm = spawn('npm', ['start'], { cwd: ROOT, env: { ...process.env, SPOTLOOM_NO_SIDELOAD: '1', CI: '' }, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    npm.stdout!.setEncoding('utf8').on('data', (c: string) => { out += c; });
    npm.stderr!.setEncoding('utf8').on('data', () => undefined);
    const printed = await new Promise<string>((resolve, reject) => {
      const guard = setTimeout(() => reject(new Error(`npm start printed no Preview: line:\n${out}`)), 170_000);
      const look = () => { if (/^Preview: .*$/m.test(out) && /^Add-in: .*$/m.test(out)) { clearTimeout(guard); resolve(out); } };
      npm!.stdout!.on('data', look);
      npm!.once('exit', (code) => { clearTimeout(guard); reject(new Error(`npm start ended (${code}):\n${out}`)); });
    });
    const preview = /^Preview: (http:\/\/localhost:(\d+)\/preview\.html)$/m.exec(printed);
    const addin = /^Add-in: (https:\/\/localhost:(\d+)\/taskpane\.html) \(manifest: (.+)\)$/m.exec(printed);
    expect(preview, printed).not.toBeNull();
    expect(addin, printed).not.toBeNull();
    const [previewPort, addinPort] = [Number(preview![2]), Number(addin![2])];
    expect([3000, 3001]).not.toContain(previewPort);
    expect([3000, 3001]).not.toContain(addinPort);
    expect(previewPort).not.toBe(addinPort);

    const page = await new Promise<{ status: number; body: string }>((resolve, reject) => {
      fetch(preview![1]).then(async (r) => resolve({ status: r.status, body: await r.text() }), reject);
    });
    expect(page.status).toBe(200);
    expect(page.body).toContain('spotloom-preview');
    const pane = await get(addin![1]);
    expect(pane.status).toBe(200);
    const manifest = await get(`https://localhost:${addinPort}/manifest.xml`);
    expect(manifest.body).toContain(`https://localhost:${addinPort}/taskpane.html`);
    expect(manifest.body).not.toContain('localhost:3000');
    expect(readFileSync(addin![3], 'utf8')).toBe(manifest.body);

    const children = descendants(npm.pid!);
    expect(children.length).toBeGreaterThan(0);
    const exited = new Promise((resolve) => npm!.once('exit', resolve));
    npm.kill('SIGTERM');
    await exited;
    await expect.poll(() => children.filter(alive), { timeout: 60_000, interval: 250 }).toEqual([]);
    expect(await portIsFree(previewPort)).toBe(true);
    expect(await portIsFree(addinPort)).toBe(true);
  }, 240_000);
});
