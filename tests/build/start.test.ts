import { readFileSync } from 'node:fs';
import { createServer, type Server } from 'node:net';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { afterEach, describe, expect, it } from 'vitest';

// The dev-server part of webpack.config.js that `npm start` runs: which
// ports it takes, what it prints, the manifest it serves. (The end-to-end
// run starts `npm start` itself with 3000 and 3001 taken: tests/e2e/npm-start.e2e.ts.)
const root = fileURLToPath(new URL('../..', import.meta.url));
const config = await import(/* @vite-ignore */ pathToFileURL(`${root}webpack.config.js`).href);
const held: Server[] = [];

function hold(port: number): Promise<void> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(port, '127.0.0.1', () => { held.push(s); resolve(); });
  });
}

afterEach(async () => {
  await Promise.all(held.splice(0).map((s) => new Promise((r) => s.close(r))));
});

describe('npm start: ports', () => {
  // a high range of its own, so that nothing else on the machine decides the outcome
  const wanted = { addin: 47310, preview: 47311 };

  it('takes the wanted ports when they are free', async () => {
    expect(await config.freePorts(wanted)).toEqual(wanted);
  });

  it('a taken add-in port moves to the next free one, past the preview\'s own', async () => {
    await hold(47310);
    expect(await config.portIsFree(47310)).toBe(false);
    expect(await config.freePorts(wanted)).toEqual({ addin: 47312, preview: 47311 });
  });

  it('both taken: the next free ports above each, never the same one', async () => {
    await hold(47310);
    await hold(47311);
    await hold(47312);
    expect(await config.freePorts(wanted)).toEqual({ addin: 47313, preview: 47314 });
  });
});

describe('npm start: what it prints and serves', () => {
  it('the Preview: line keeps its form on a moved port and says which ports were taken, singular or plural', () => {
    const both = config.announcement({ addin: 3002, preview: 3003 }, '/tmp/m.xml', 'linux') as string[];
    expect(both).toContain('Ports 3000 and 3001 are taken: serving the add-in on 3002 and the preview on 3003.');
    expect(both).toContain('Preview: http://localhost:3003/preview.html');
    expect(both).toContain('Add-in: https://localhost:3002/taskpane.html (manifest: /tmp/m.xml)');
    const one = config.announcement({ addin: 3000, preview: 3002 }, '/tmp/m.xml', 'linux') as string[];
    expect(one).toContain('Port 3001 is taken: serving the preview on 3002.');
    const usual = config.announcement({ addin: 3000, preview: 3001 }, 'manifest.xml', 'linux') as string[];
    expect(usual.some((l) => /taken/.test(l))).toBe(false);
  });

  it('the manifest served for a moved add-in port names that port everywhere', () => {
    const text = readFileSync(`${root}manifest.xml`, 'utf8');
    expect(config.manifestFor(text, 3000)).toBe(text);
    const moved = config.manifestFor(text, 3002) as string;
    expect(moved).not.toMatch(/localhost:3000/);
    expect(moved.match(/https:\/\/localhost:3002\//g)?.length).toBe(text.match(/https:\/\/localhost:3000\//g)?.length);
  });

  it('README.md gives the same upload steps for the web version as npm start prints', () => {
    const readme = readFileSync(`${root}README.md`, 'utf8');
    for (const step of config.LINUX_STEPS as string[]) expect(readme).toContain(step.replace(/;$|\.$/, ''));
  });
});
