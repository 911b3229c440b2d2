import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import vm from 'node:vm';
import webpack from 'webpack';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, holidaysOfYear } from '../../src/engine';
import { baseline } from '../../src/functions/baseline';
import { column, serials, syntheticMarket } from '../functions/synthetic';

// Builds the add-in with its own webpack.config.js (development mode: the
// same entries, plugins and resolution, without the minifier's minute) into
// a temporary folder, then runs the functions bundle in a V8 context where
// code generation from strings is switched off, as a Content-Security-Policy
// without 'unsafe-eval' does in the browser.
const root = fileURLToPath(new URL('../..', import.meta.url));
const configUrl = pathToFileURL(join(root, 'webpack.config.js')).href;
let out: string;
let probeOut: string;

function compile(config: webpack.Configuration): Promise<webpack.Stats> {
  return new Promise((resolve, reject) => {
    webpack(config, (err, stats) => {
      if (err) return reject(err);
      if (!stats || stats.hasErrors()) return reject(new Error(stats?.toString({ all: false, errors: true }) ?? 'no stats'));
      resolve(stats);
    });
  });
}

function strictContext(extra: Record<string, unknown> = {}): vm.Context {
  const sandbox: Record<string, unknown> = { console, setTimeout, clearTimeout, queueMicrotask, URL, TextEncoder, TextDecoder, ...extra };
  sandbox.self = sandbox;
  sandbox.window = sandbox;
  return vm.createContext(sandbox, { codeGeneration: { strings: false, wasm: false } });
}

beforeAll(async () => {
  out = mkdtempSync(join(tmpdir(), 'spotloom-dist-'));
  probeOut = mkdtempSync(join(tmpdir(), 'spotloom-probe-'));
  const { default: makeConfig, resolveOptions, moduleRules } = await import(/* @vite-ignore */ configUrl);
  const config = await makeConfig({}, { mode: 'development' });
  await compile({ ...config, output: { ...config.output, path: out }, infrastructureLogging: { level: 'error' } });
  await compile({
    mode: 'production', context: root, target: 'web', devtool: false,
    entry: join(root, 'tests/build/fixtures/brain-probe.ts'),
    output: { path: probeOut, filename: 'probe.js' },
    resolve: resolveOptions, module: { rules: moduleRules },
  });
}, 240_000);

afterAll(() => {
  for (const dir of [out, probeOut]) if (dir) rmSync(dir, { recursive: true, force: true });
});

describe('the build (webpack.config.js)', () => {
  it('writes the page, both bundles, functions.json, the manifest, icons and the host\'s script', () => {
    for (const file of ['taskpane.html', 'runtime.js', 'taskpane.js', 'functions.js', 'functions.json', 'manifest.xml', 'office-js/office.js', 'office-js/excel-web-16.00.js', 'office-js/custom-functions-runtime.js', 'office-js/en-us/office_strings.js']) {
      expect(existsSync(join(out, file)), file).toBe(true);
    }
    for (const size of [16, 32, 64, 80]) {
      const png = readFileSync(join(out, `assets/icon-${size}.png`));
      expect(png.subarray(1, 4).toString('ascii')).toBe('PNG');
      expect(png.readUInt32BE(16)).toBe(size);
    }
    expect(existsSync(join(out, 'office-js/office.debug.js'))).toBe(false);
  });

  it('taskpane.html loads the host\'s script from this origin, then one runtime for the pane and the functions', () => {
    const html = readFileSync(join(out, 'taskpane.html'), 'utf8');
    const scripts = [...html.matchAll(/<script[^>]*src="?([^"\s>]+)"?/g)].map((m) => m[1]);
    expect(scripts[0]).toBe('office-js/office.js');
    expect(scripts.filter((s) => s === 'runtime.js')).toHaveLength(1);
    expect(scripts).toContain('taskpane.js');
    expect(scripts).toContain('functions.js');
    expect(scripts.every((s) => !/^https?:/.test(s))).toBe(true);
  });

  it('the task pane page leaves the preview\'s formula libraries out (only preview.html loads them)', () => {
    const scripts = (page: string) => [...readFileSync(join(out, page), 'utf8').matchAll(/<script[^>]*src="?([^"\s>]+)"?/g)].map((m) => m[1]).filter((s) => !s.startsWith('office-js/'));
    const library = (s: string) => /toFastProperties|formulajs|is not a function the preview knows/.test(readFileSync(join(out, s), 'utf8'));
    expect(scripts('taskpane.html').filter(library)).toEqual([]);
    expect(scripts('preview.html').some(library)).toBe(true);
  });

  it('functions.json lists the seven LOOM functions', () => {
    const meta = JSON.parse(readFileSync(join(out, 'functions.json'), 'utf8'));
    expect(meta.functions.map((f: { id: string }) => f.id).sort()).toEqual(['AHEAD', 'BAND', 'BASELINE', 'COMPARE', 'EXPLAIN', 'HOLIDAY', 'MODEL', 'SCORE']);
  });

  it('wraps no module in eval() and leaves gpu.js out', () => {
    const js = readdirSync(out).filter((f) => f.endsWith('.js'));
    for (const f of js) {
      const code = readFileSync(join(out, f), 'utf8');
      // chevrotain (the preview's formula parser) may keep one unreachable eval( after a `return` in
      // toFastProperties, to keep V8 from optimising that helper; it never runs, and the minifier drops it
      const unreachable = code.includes('function toFastProperties(') ? 1 : 0;
      expect(code.split('eval(').length - 1, f).toBeLessThanOrEqual(unreachable);
      // characteristic of gpu.js's WebGL backend, which must not be bundled
      expect(code.includes('WebGL2Kernel'), f).toBe(false);
    }
  });

  it('the functions bundle registers every LOOM function and they compute without code generation from strings', async () => {
    const associated = new Map<string, (...args: unknown[]) => Promise<unknown>>();
    const loadedChunks: string[] = [];
    class CellError extends Error { constructor(readonly code: string, message?: string) { super(message); } }
    const context = strictContext({
      // webpack's automatic public path reads the running script's address; a lazy chunk
      // (a country's holiday rules, the rule reader) arrives as a script element added to the head
      document: {
        baseURI: 'https://localhost:3000/taskpane.html',
        currentScript: { tagName: 'SCRIPT', src: 'https://localhost:3000/functions.js' },
        getElementsByTagName: () => [],
        createElement: () => ({ setAttribute() {}, getAttribute: () => null }),
        head: { appendChild: (script: { src: string; onload?: (e: unknown) => void; onerror?: (e: unknown) => void }) => setTimeout(() => {
          const file = new URL(script.src).pathname.slice(1);
          try {
            vm.runInContext(readFileSync(join(out, file), 'utf8'), context, { filename: file });
            loadedChunks.push(file);
            script.onload?.({ type: 'load', target: script });
          } catch (err) {
            script.onerror?.({ type: 'error', target: script, err });
          }
        }) },
      },
      CustomFunctions: {
        associate: (id: string, fn: (...args: unknown[]) => Promise<unknown>) => associated.set(id, fn),
        Error: CellError,
        ErrorCode: { invalidValue: '#VALUE!', notAvailable: '#N/A' },
      },
    });
    const html = readFileSync(join(out, 'taskpane.html'), 'utf8');
    const scripts = [...html.matchAll(/<script[^>]*src="?([^"\s>]+)"?/g)].map((m) => m[1]).filter((s) => !s.startsWith('office-js/') && s !== 'taskpane.js');
    for (const s of scripts) vm.runInContext(readFileSync(join(out, s), 'utf8'), context, { filename: s });
    expect([...associated.keys()].sort()).toEqual(['AHEAD', 'BAND', 'BASELINE', 'COMPARE', 'EXPLAIN', 'HOLIDAY', 'MODEL', 'SCORE']);

    expect(await associated.get('HOLIDAY')!(45933, 'DE')).toBe('Tag der Deutschen Einheit');
    // each region's rules arrive as their own chunk, read by the browser build's rule reader (its
    // time-zone calls on luxon, not moment-timezone): the same holidays as the engine in Node, which
    // reads the package whole with moment-timezone. Regions with equinox (JP), Chinese (CN, KR),
    // Hebrew (IL), Islamic (EG) calendar rules, one whose rules refer to another's (GU → US), a state.
    expect(loadedChunks.some((f) => f.startsWith('holidays-DE'))).toBe(true);
    for (const region of ['DE-BY', 'JP', 'CN', 'KR', 'IL', 'EG', 'GU', 'US-CA', 'AU-SA', 'BR', 'FR', 'GB']) {
      for (const year of [2025, 2026]) {
        const node = holidaysOfYear(year, region);
        const got: [string, string][] = [];
        for (let day = 0; day < 365; day++) {
          const date = addDays(`${year}-01-01`, day);
          const name = await associated.get('HOLIDAY')!(date, region);
          if (name) got.push([date, name as string]);
        }
        expect(got, `${region} ${year}`).toEqual([...node]);
      }
    }
    // one chunk per country asked for, and none for US: GU's chunk brought its rules along
    expect(loadedChunks.filter((f) => f.startsWith('holidays-')).map((f) => f.slice(9, 11)).sort()).toEqual(['AU', 'BR', 'CN', 'DE', 'EG', 'FR', 'GB', 'GU', 'IL', 'JP', 'KR']);
    expect(loadedChunks.some((f) => f.startsWith('moment'))).toBe(false);
    expect(await associated.get('SCORE')!([[10], [20]], [[12], [17]], null, null)).toBe(2.5);
    const m = syntheticMarket('2025-01-01', 20);
    const bundled = await associated.get('BASELINE')!(column(serials(m)), column(m.price), 'week', null);
    expect(bundled).toEqual(baseline(column(serials(m)), column(m.price), 'week', null));
    await expect(associated.get('SCORE')!([['x']], [[1]], null, null)).rejects.toMatchObject({ code: '#VALUE!' });
  });

  it('brain.js\'s CPU network trains in a bundle without gpu.js and without code generation from strings', () => {
    const code = readFileSync(join(probeOut, 'probe.js'), 'utf8');
    expect(code.includes('WebGL2Kernel')).toBe(false);
    const context = strictContext();
    vm.runInContext(code, context);
    const { outputs, error } = (context as { probe: { outputs: number[]; error: number } }).probe;
    expect(error).toBeLessThan(0.05);
    expect(outputs[0]).toBeLessThan(0.3);
    expect(outputs[2]).toBeGreaterThan(0.7);
  });
});
