// Build of the Spotloom add-in: one page (taskpane.html) that hosts both the
// task pane and the LOOM cell functions in the shared runtime the manifest
// asks for, the functions' metadata (functions.json) generated from the JSDoc
// of src/functions/functions.ts, and the host's own script copied from the
// @microsoft/office-js package so that nothing is fetched from the network.
//
//   npm run build   production build into dist/
//   npm start       development build served on https://localhost:3000
//                   (and the standalone preview on http://localhost:3001);
//                   a port that is taken moves to the next free one, and the
//                   addresses printed are the ones served
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:http';
import { createRequire } from 'node:module';
import { createServer as createNetServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { deflateSync } from 'node:zlib';
import CopyWebpackPlugin from 'copy-webpack-plugin';
import CustomFunctionsMetadataPlugin from 'custom-functions-metadata-plugin';
import HtmlWebpackPlugin from 'html-webpack-plugin';
import webpack from 'webpack';

const root = path.dirname(fileURLToPath(import.meta.url));
const require = createRequire(import.meta.url);
const from = (...parts) => path.resolve(root, ...parts);

export const ADDIN_PORT = 3000;
export const PREVIEW_PORT = 3001;
export const FUNCTIONS_SOURCE = from('src/functions/functions.ts');

/**
 * Module resolution shared by the build and tests/build: brain.js's browser
 * file carries its GPU backend (gpu.js) inside it, and gpu.js compiles its
 * kernels from strings, which a Content-Security-Policy without
 * 'unsafe-eval' forbids. We train on the CPU, so we take brain.js's plain
 * CommonJS build and let its `require('gpu.js')` resolve to an empty module;
 * brain.js touches gpu.js only inside its GPU classes and the layer API,
 * never in the CPU NeuralNetwork (checked by tests/build/bundle.test.ts).
 */
export const resolveOptions = {
  extensions: ['.ts', '.js'],
  alias: {
    'brain.js$': require.resolve('brain.js/dist/index.js'),
    'gpu.js': false,
  },
  // seedrandom probes for Node's crypto module; the browser has its own
  fallback: { crypto: false },
};

/**
 * The holiday rules, one chunk per country: the calendar's chunk list
 * (src/engine/calendar/holiday-chunks.ts) is written by
 * scripts/holiday-chunks-loader.cjs, date-holidays' own data module (every
 * country, about 800 KB) becomes an empty rule set that the chunks fill
 * (src/engine/calendar/holiday-data.browser.ts), and the package's class is
 * loaded lazily (src/engine/calendar/holiday-parser.browser.ts).
 */
const HOLIDAY_CHUNKS = from('src/engine/calendar/holiday-chunks.ts');
export const holidaySwaps = () => [
  new webpack.NormalModuleReplacementPlugin(/date-holidays[\\/]src[\\/]data\.js$/, from('src/engine/calendar/holiday-data.browser.ts')),
  // the class that reads the rules (with its calendars and zone tables) comes as a lazy chunk too
  new webpack.NormalModuleReplacementPlugin(/calendar[\\/]holiday-parser\.ts$/, from('src/engine/calendar/holiday-parser.browser.ts')),
  // its time-zone calls go to luxon, the engine's own date-time library, instead of moment-timezone
  new webpack.NormalModuleReplacementPlugin(/^moment-timezone$/, from('src/engine/calendar/moment-timezone.browser.ts')),
  // astronomia's planet tables: the equinox rules need only the Earth's (date-holidays' README, "Bundling with webpack")
  new webpack.IgnorePlugin({
    checkResource: (resource, context) => /[\\/]astronomia[\\/]data$/.test(context) && !['./deltat.js', './vsop87Bearth.js'].includes(resource),
  }),
];

/** The rules that compile our TypeScript (type checking is `npm run typecheck`). */
export const moduleRules = [
  { test: HOLIDAY_CHUNKS, use: from('scripts/holiday-chunks-loader.cjs'), type: 'javascript/auto' },
  {
    test: /\.ts$/,
    exclude: [/node_modules/, HOLIDAY_CHUNKS],
    use: { loader: 'ts-loader', options: { configFile: from('tsconfig.json'), transpileOnly: true, onlyCompileBundledFiles: true } },
  },
];

// The host's script loads its per-application parts from its own folder;
// Excel's parts, the custom-functions runtime and the string tables are all
// it needs here (debug copies, other applications and telemetry are left out).
const OFFICE_JS = path.dirname(require.resolve('@microsoft/office-js/dist/office.js'));
const OFFICE_FILES = [
  'office.js', 'excel*.js', 'custom-functions-runtime.js', 'o15apptofilemappingtable.js', 'es6-promise.js', '*/office_strings.js',
];

function officeCopies() {
  return OFFICE_FILES.map((pattern) => ({
    from: pattern,
    context: OFFICE_JS,
    to: 'office-js/',
    globOptions: { ignore: ['**/*.debug.js', '**/telemetry/**', '**/ariatelemetry/**'] },
    noErrorOnMissing: pattern.includes('*'),
    // already minified by its publisher: keeps the minimizer off 12 MB of it
    info: { minimized: true },
  }));
}

/** The pane engineer's page and script; the standalone preview joins when it exists. */
function pages() {
  const entries = {
    taskpane: from('src/pane/index.ts'),
    functions: from('src/functions/register.ts'),
  };
  const html = [
    new HtmlWebpackPlugin({ filename: 'taskpane.html', template: from('src/pane/taskpane.html'), chunks: ['taskpane', 'functions'] }),
  ];
  const preview = from('src/preview/index.ts');
  if (existsSync(preview) && existsSync(from('src/preview/preview.html'))) {
    entries.preview = preview;
    html.push(new HtmlWebpackPlugin({ filename: 'preview.html', template: from('src/preview/preview.html'), chunks: ['preview'] }));
  }
  return { entries, html };
}

export default async function config(env = {}, argv = {}) {
  const mode = argv.mode ?? (env.WEBPACK_SERVE ? 'development' : 'production');
  const { entries, html } = pages();
  const ports = env.WEBPACK_SERVE ? await freePorts() : { addin: ADDIN_PORT, preview: PREVIEW_PORT };
  return {
    mode,
    context: root,
    entry: entries,
    target: 'web',
    // 'source-map' writes separate .map files; webpack's development default
    // wraps modules in eval(), which a strict Content-Security-Policy refuses.
    devtool: 'source-map',
    output: { path: from('dist'), filename: '[name].js', chunkFilename: '[name].[contenthash:8].js', clean: true },
    resolve: resolveOptions,
    module: { rules: moduleRules },
    optimization: {
      // one webpack runtime for the page, so the pane and the functions share
      // every module instance (above all the model cache in src/host/model-store.ts)
      runtimeChunk: 'single',
      splitChunks: { chunks: 'all' },
    },
    performance: { hints: false },
    plugins: [
      new CustomFunctionsMetadataPlugin({ output: 'functions.json', input: FUNCTIONS_SOURCE }),
      ...holidaySwaps(),
      ...html,
      new CopyWebpackPlugin({ patterns: [...officeCopies(), { from: from('manifest.xml'), to: 'manifest.xml', transform: (text) => manifestFor(text.toString(), ports.addin) }] }),
      new IconPlugin(),
    ],
    devServer: env.WEBPACK_SERVE ? await devServer(ports) : undefined,
  };
}

/** The manifest with its addresses on the port the add-in is served from (3000 as written). */
export function manifestFor(text, port) {
  return port === ADDIN_PORT ? text : text.replaceAll(`https://localhost:${ADDIN_PORT}`, `https://localhost:${port}`);
}

/**
 * True when nothing listens on `port` on this machine's loopback, over IPv4
 * and (where the machine has it) IPv6: "localhost" may reach either.
 */
export async function portIsFree(port) {
  const tryListen = (host) => new Promise((resolve) => {
    const probe = createNetServer();
    probe.once('error', (err) => resolve(err.code === 'EADDRNOTAVAIL' || err.code === 'EAFNOSUPPORT' ? 'absent' : 'taken'));
    probe.listen({ port, host, exclusive: true }, () => probe.close(() => resolve('free')));
  });
  const v4 = await tryListen('127.0.0.1');
  if (v4 !== 'free') return false;
  return (await tryListen('::1')) !== 'taken';
}

/**
 * The ports `npm start` serves on: 3000 for the add-in and 3001 for the
 * preview when they are free, else the next free port above each; the
 * add-in never takes the preview's own port, and the two never share one.
 */
export async function freePorts(wanted = { addin: ADDIN_PORT, preview: PREVIEW_PORT }, tries = 200) {
  const next = async (start, avoid) => {
    for (let p = start; p < start + tries; p++) if (p !== avoid && (await portIsFree(p))) return p;
    throw new Error(`no free port between ${start} and ${start + tries - 1}`);
  };
  const addin = await next(wanted.addin, wanted.preview);
  const preview = await next(wanted.preview, addin);
  return { addin, preview };
}

/** Development server: HTTPS with trusted localhost certificates, no injected client script. */
async function devServer(ports) {
  const manifest = movedManifest(ports.addin);
  return {
    host: 'localhost', // nothing is served beyond this machine
    port: ports.addin,
    server: { type: 'https', options: await httpsOptions(ports.addin) },
    // the same policy as the pages' meta tag, as a header so that the training worker is under it too
    headers: {
      'Access-Control-Allow-Origin': '*',
      'Content-Security-Policy': "default-src 'self'; script-src 'self'; style-src 'self'; worker-src 'self' blob:; connect-src 'self'; img-src 'self' data:",
    },
    // no hot reload and no live-reload client: it would inject a script and a
    // WebSocket that the pane's Content-Security-Policy rightly refuses
    hot: false,
    liveReload: false,
    client: false,
    webSocketServer: false,
    static: false,
    onListening(server) {
      const preview = createServer(server.app);
      preview.on('error', (err) => {
        // taken between the look and the listen: one line, no stack
        process.stderr.write(`The preview could not be served on port ${ports.preview} (${err.code ?? err.message}); run npm start again.\n`);
        process.exit(1);
      });
      preview.listen(ports.preview, 'localhost', () => announce(ports, manifest));
      // `npm start` execs webpack, so a stopped npm stops both servers through its signal; should npm
      // die without one (killed outright), this process is handed to another parent and ends itself
      const parent = process.ppid;
      setInterval(() => { if (process.ppid !== parent) process.exit(0); }, 1000).unref();
    },
  };
}

/**
 * Where the manifest for the add-in's port is: the repository's own for
 * 3000; for another port a copy with that port, written to the system's
 * temporary folder (the repository's file stays as it is).
 */
function movedManifest(port) {
  const own = from('manifest.xml');
  if (port === ADDIN_PORT) return own;
  const dir = path.join(tmpdir(), 'spotloom');
  mkdirSync(dir, { recursive: true });
  const file = path.join(dir, `manifest-localhost-${port}.xml`);
  writeFileSync(file, manifestFor(readFileSync(own, 'utf8'), port));
  return file;
}

/**
 * Trusted localhost certificates from office-addin-dev-certs where it can
 * install its CA into the system's trust store (Windows, macOS; it asks
 * first). Elsewhere the browser keeps its own store, so the server uses a
 * self-signed certificate that the user accepts once in the browser.
 */
async function httpsOptions(port) {
  if (process.platform !== 'win32' && process.platform !== 'darwin') return {};
  try {
    const certs = await import('office-addin-dev-certs');
    return await (certs.default ?? certs).getHttpsServerOptions();
  } catch (err) {
    process.stderr.write(
      `Could not set up trusted localhost certificates (${err instanceof Error ? err.message : err}); ` +
        `serving with a self-signed one: open https://localhost:${port}/taskpane.html once in your browser and accept it.\n`,
    );
    return {};
  }
}

/** The steps printed on Linux for the web version of the spreadsheet (README.md repeats them). */
export const LINUX_STEPS = [
  'open a workbook in the browser;',
  'Home > Add-ins > More Add-ins > My Add-ins > Upload My Add-in (or Manage My Add-ins > Upload);',
  'choose the manifest named above;',
  'open the Spotloom group on the Home tab and press "Open Spotloom".',
];

/** The lines `npm start` prints once both servers listen. */
export function announcement(ports, manifest, platform = process.platform) {
  const preview = existsSync(from('src/preview/index.ts'));
  const moved = [ports.addin !== ADDIN_PORT && `add-in on ${ports.addin}`, ports.preview !== PREVIEW_PORT && `preview on ${ports.preview}`].filter(Boolean);
  const lines = [''];
  const taken = [ports.addin !== ADDIN_PORT && ADDIN_PORT, ports.preview !== PREVIEW_PORT && PREVIEW_PORT].filter(Boolean);
  if (moved.length) lines.push(`${taken.length === 1 ? 'Port' : 'Ports'} ${taken.join(' and ')} ${taken.length === 1 ? 'is' : 'are'} taken: serving the ${moved.join(' and the ')}.`);
  lines.push(
    `Add-in: https://localhost:${ports.addin}/taskpane.html (manifest: ${manifest})`,
    preview ? `Preview: http://localhost:${ports.preview}/preview.html` : `Preview: not built yet (src/preview/index.ts is missing)`,
  );
  if (platform === 'win32' || platform === 'darwin') {
    lines.push('Sideloading the add-in into the desktop spreadsheet application (set SPOTLOOM_NO_SIDELOAD=1 to skip) ...');
  } else {
    lines.push(
      'To try the add-in in the web version of the spreadsheet application:',
      ...LINUX_STEPS.map((step, i) => `  ${i + 1}. ${step}`),
      `  The server's certificate is self-signed: open https://localhost:${ports.addin}/taskpane.html once in that browser and accept it first.`,
    );
  }
  lines.push('Forecasts are estimates with stated error, not trading advice.', 'Stop with Ctrl+C.', '');
  return lines;
}

function announce(ports, manifest) {
  process.stdout.write(announcement(ports, manifest).join('\n') + '\n');
  if ((process.platform === 'win32' || process.platform === 'darwin') && !process.env.SPOTLOOM_NO_SIDELOAD) sideload(manifest);
}

async function sideload(manifest) {
  try {
    const settings = await import('office-addin-dev-settings');
    await (settings.default ?? settings).sideloadAddIn(manifest, 'excel', true);
  } catch (err) {
    process.stderr.write(`Sideloading failed (${err instanceof Error ? err.message : err}); upload manifest.xml by hand as described for the web version.\n`);
  }
}

/**
 * Emits the add-in's icons (16, 32, 64 and 80 px) as PNG files drawn here, so
 * that no binary files live in the repository: a woven pattern of warp and
 * weft threads in two colours.
 */
class IconPlugin {
  apply(compiler) {
    compiler.hooks.thisCompilation.tap('SpotloomIcons', (compilation) => {
      compilation.hooks.processAssets.tap({ name: 'SpotloomIcons', stage: webpack.Compilation.PROCESS_ASSETS_STAGE_ADDITIONAL }, () => {
        for (const size of [16, 32, 64, 80]) {
          compilation.emitAsset(`assets/icon-${size}.png`, new webpack.sources.RawSource(weaveIcon(size)));
        }
      });
    });
  }
}

export function weaveIcon(size) {
  const warp = [0x1f, 0x6f, 0x8b], weft = [0xf2, 0xa5, 0x41], gap = [0xff, 0xff, 0xff];
  const band = Math.max(2, Math.round(size / 8));
  const raw = Buffer.alloc(size * (size * 4 + 1));
  for (let y = 0; y < size; y++) {
    raw[y * (size * 4 + 1)] = 0; // filter: none
    for (let x = 0; x < size; x++) {
      const bx = Math.floor(x / band), by = Math.floor(y / band);
      const edge = x % band === band - 1 || y % band === band - 1;
      const colour = edge && size > 16 ? gap : (bx + by) % 2 === 0 ? warp : weft;
      raw.set([...colour, 0xff], y * (size * 4 + 1) + 1 + x * 4);
    }
  }
  const chunk = (type, data) => {
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
    const out = Buffer.alloc(12 + data.length);
    out.writeUInt32BE(data.length, 0);
    body.copy(out, 4);
    out.writeUInt32BE(crc32(body), 8 + data.length);
    return out;
  };
  const header = Buffer.alloc(13);
  header.writeUInt32BE(size, 0);
  header.writeUInt32BE(size, 4);
  header.set([8, 6, 0, 0, 0], 8); // 8-bit RGBA, no interlace
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(raw)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

// CRC-32 as PNG (ISO/IEC 15948, annex D) defines it
function crc32(buf) {
  let c = ~0;
  for (const byte of buf) {
    c ^= byte;
    for (let k = 0; k < 8; k++) c = (c >>> 1) ^ (0xedb88320 & -(c & 1));
  }
  return ~c >>> 0;
}
