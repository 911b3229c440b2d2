// webpack loader for src/engine/calendar/holiday-chunks.ts in the add-in's
// browser build (webpack.config.js). Without a query it writes the module
// that lists date-holidays' countries and imports each one's rules lazily,
// as a chunk `holidays-CC`; with `?country=CC` it writes that chunk: the
// country's rules, the rules of the countries they point to (`_days`, e.g.
// GU → US, FR → its overseas regions and back) and the shared holiday names.
// The package's data is read here, in Node, at build time.
const { data } = require('date-holidays/data');

function referenced(rules) {
  const out = new Set();
  JSON.stringify(rules, (key, value) => {
    if (key === '_days') out.add(Array.isArray(value) ? value[0] : String(value).split(/[./]/)[0]);
    return value;
  });
  return out;
}

function countryChunk(code) {
  const picked = {};
  const queue = [code];
  while (queue.length) {
    const c = queue.shift();
    if (picked[c] || !data.holidays[c]) continue;
    picked[c] = data.holidays[c];
    queue.push(...referenced(data.holidays[c]));
  }
  return `export default ${JSON.stringify({ holidays: picked, names: data.names })};\n`;
}

function countryList(resource) {
  const codes = Object.keys(data.holidays).sort();
  const file = JSON.stringify(`./${resource.split(/[\\/]/).pop()}`);
  const imports = codes.map((c) => `  ${JSON.stringify(c)}: () => import(/* webpackChunkName: "holidays-${c}" */ ${file.slice(0, -1)}?country=${c}")`);
  return [
    `export const LAZY_COUNTRIES = ${JSON.stringify(codes)};`,
    `const chunks = {\n${imports.join(',\n')}\n};`,
    'export function loadHolidayCountry(country) {',
    '  const c = LAZY_COUNTRIES.find((k) => k.toUpperCase() === String(country).toUpperCase());',
    '  return c ? chunks[c]().then((m) => m.default) : Promise.resolve(undefined);',
    '}',
    '',
  ].join('\n');
}

module.exports = function holidayChunksLoader() {
  this.cacheable(true);
  this.addDependency(require.resolve('date-holidays/data'));
  const country = new URLSearchParams(this.resourceQuery.replace(/^\?/, '')).get('country');
  return country ? countryChunk(country) : countryList(this.resourcePath);
};
