// Build of the Spotloom add-in: one page (taskpane.html) that hosts both the
// task pane and the LOOM cell functions in the shared runtime the manifest
// asks for, the functions' metadata (functions.json) generated from the JSDoc
// of src/functions/functions.ts, and the host's own script copied from the
// @microsoft/office-js package so that nothing is fetched from the network.
//
//   npm run build   production build into dist/
//   npm start       development build served on https://localhost:3000
//                   (and the standalone preview on http://localhost:3001)
import { existsSync } from 'node:fs';
import { createServer } from 'node:http';
import { createRequire } from 'node:module';
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

/** The rules that compile our TypeScript (type checking is `npm run typecheck`). */
export const moduleRules = [
  {
    test: /\.ts$/,
    exclude: /node_modules/,
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
      ...html,
      new CopyWebpackPlugin({ patterns: [...officeCopies(), { from: from('manifest.xml'), to: 'manifest.xml' }] }),
      new IconPlugin(),
    ],
    devServer: env.WEBPACK_SERVE ? await devServer() : undefined,
  };
}

/** Development server: HTTPS with trusted localhost certificates, no injected client script. */
async function devServer() {
  return {
    host: 'localhost', // nothing is served beyond this machine
    port: ADDIN_PORT,
    server: { type: 'https', options: await httpsOptions() },
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
      createServer(server.app).listen(PREVIEW_PORT, 'localhost');
      announce();
    },
  };
}

/**
 * Trusted localhost certificates from office-addin-dev-certs where it can
 * install its CA into the system's trust store (Windows, macOS; it asks
 * first). Elsewhere the browser keeps its own store, so the server uses a
 * self-signed certificate that the user accepts once in the browser.
 */
async function httpsOptions() {
  if (process.platform !== 'win32' && process.platform !== 'darwin') return {};
  try {
    const certs = await import('office-addin-dev-certs');
    return await (certs.default ?? certs).getHttpsServerOptions();
  } catch (err) {
    process.stderr.write(
      `Could not set up trusted localhost certificates (${err instanceof Error ? err.message : err}); ` +
        `serving with a self-signed one: open https://localhost:${ADDIN_PORT}/taskpane.html once in your browser and accept it.\n`,
    );
    return {};
  }
}

function announce() {
  const manifest = from('manifest.xml');
  const preview = existsSync(from('src/preview/index.ts'));
  const lines = [
    '',
    `Add-in: https://localhost:${ADDIN_PORT}/taskpane.html (manifest: ${manifest})`,
    preview ? `Preview: http://localhost:${PREVIEW_PORT}/preview.html` : `Preview: not built yet (src/preview/index.ts is missing)`,
  ];
  if (process.platform === 'win32' || process.platform === 'darwin') {
    lines.push('Sideloading the add-in into the desktop spreadsheet application (set SPOTLOOM_NO_SIDELOAD=1 to skip) ...');
    if (!process.env.SPOTLOOM_NO_SIDELOAD) sideload(manifest);
  } else {
    lines.push(
      'To try the add-in in the web version of the spreadsheet application:',
      '  1. open a workbook in the browser;',
      '  2. Home > Add-ins > More Add-ins > My Add-ins > Upload My Add-in (or Manage My Add-ins > Upload);',
      `  3. choose ${manifest};`,
      '  4. open the Spotloom group on the Home tab and press "Open Spotloom".',
      `  The server's certificate is self-signed: open https://localhost:${ADDIN_PORT}/taskpane.html once in that browser and accept it first.`,
    );
  }
  lines.push('Forecasts are estimates with stated error, not trading advice.', '');
  process.stdout.write(lines.join('\n') + '\n');
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
