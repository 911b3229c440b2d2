import { join } from 'node:path';
import seedrandom from 'seedrandom';
import { formatTimestamp } from '../../src/engine';
import { writeFile } from './run-cli';

/**
 * A plain data file (`,`, `.` decimals, ISO timestamps with offsets) of
 * hourly Europe/Berlin periods over the autumn change (the 25-hour day
 * 2025-10-26, Directive 2000/84/EC), with negative prices, loads in the
 * thousands and empty cells; and the same file written in each dialect a
 * desk exports. Invented values: these files test the reading, not a model.
 */
export const FIRST_DAY = '2025-06-02';
export const LAST_DAY = '2025-11-02';

export function plainFile(): string {
  const rng = seedrandom('dialects');
  const rows = ['timestamp,price,load_forecast,wind_forecast'];
  const t0 = Date.parse('2025-06-01T22:00:00Z'); // local midnight of FIRST_DAY
  const t1 = Date.parse('2025-11-02T23:00:00Z'); // local midnight after LAST_DAY
  let noise = 0;
  for (let t = t0, k = 0; t < t1; t += 3_600_000, k++) {
    const hour = new Date(t).getUTCHours();
    const load = 5200 + 900 * Math.sin(((hour - 6) / 24) * 2 * Math.PI) + 300 * rng();
    const wind = 800 * rng() ** 2;
    noise = 0.7 * noise + 6 * (rng() - 0.5);
    const price = -60 + 0.018 * load - 0.05 * wind + noise;
    const gap = (n: number) => k % n === 5;
    rows.push([
      formatTimestamp(t, 'Europe/Berlin'),
      gap(211) ? '' : price.toFixed(2),
      gap(97) ? '' : load.toFixed(1),
      gap(53) ? '' : wind.toFixed(1),
    ].join(','));
  }
  return `${rows.join('\n')}\n`;
}

type Cells = string[][];
const cellsOf = (text: string): Cells => text.trimEnd().split('\n').map((l) => l.split(','));
const write = (cells: Cells, sep: string, eol = '\n') => `${cells.map((c) => c.join(sep)).join(eol)}${eol}`;
const body = (cells: Cells, f: (cell: string, column: number) => string): Cells => [cells[0], ...cells.slice(1).map((r) => r.map(f))];

/** 6012.5 as a continental spreadsheet writes it: 6.012,5 */
function continental(text: string): string {
  const [whole, frac] = text.split('.');
  const sign = whole.startsWith('-') ? '-' : '';
  const digits = whole.replace('-', '').replace(/\B(?=(\d{3})+(?!\d))/g, '.');
  return `${sign}${digits}${frac === undefined ? '' : `,${frac}`}`;
}

const MARKERS = ['NA', 'N/A', 'n/a', '#N/A', '-', 'null', 'NaN'];
const wall = (stamp: string) => stamp.slice(0, 16).replace('T', ' ');

/** The plain file in every dialect the reader promises to read the same. */
export function dialects(plain: string): Record<string, string> {
  const cells = cellsOf(plain);
  let m = 0;
  return {
    'semicolon-decimal-comma': write(body(cells, (c, j) => (j === 0 || c === '' ? c : continental(c))), ';'),
    tab: write(cells, '\t'),
    'local-wall-clock': write(body(cells, (c, j) => (j === 0 ? wall(c) : c)), ','),
    'missing-markers': write(body(cells, (c) => (c === '' ? MARKERS[m++ % MARKERS.length] : c)), ','),
    'bom-crlf': `\ufeff${write(cells, ',', '\r\n')}`,
    'all-at-once': `\ufeff${write(body(cells, (c, j) => (j === 0 ? wall(c) : c === '' ? MARKERS[m++ % MARKERS.length] : continental(c))), ';', '\r\n')}`,
  };
}

/**
 * The daily files of a desk's morning, written into `dir`: history to
 * 2025-10-25, the same with tomorrow (the 25-hour 2025-10-26, Directive
 * 2000/84/EC) appended with empty prices, and tomorrow's drivers in a file
 * of their own as a continental desk writes them (`;`, decimal commas,
 * local wall clock, columns in another order); `model` is where a test
 * saves the model it trains.
 */
export function dailyFiles(dir: string): { historyFile: string; oneFile: string; driversFile: string; model: string } {
  const lines = plainFile().trimEnd().split('\n');
  const header = lines[0];
  const history = lines.filter((l, i) => i > 0 && l < '2025-10-26');
  const tomorrow = lines.filter((l) => l.startsWith('2025-10-26'));
  return {
    historyFile: writeFile(dir, 'history.csv', `${[header, ...history].join('\n')}\n`),
    oneFile: writeFile(dir, 'one-file.csv', `${[header, ...history, ...tomorrow.map((l) => l.replace(/^([^,]*),[^,]*,/, '$1,,'))].join('\n')}\n`),
    driversFile: writeFile(dir, 'drivers-2025-10-26.csv', `${['timestamp;wind_forecast;load_forecast', ...tomorrow.map((l) => {
      const [t, , load, wind] = l.split(',');
      return [t.slice(0, 16).replace('T', ' '), wind.replace('.', ','), load.replace('.', ',')].join(';');
    })].join('\n')}\n`),
    model: join(dir, 'linear.json'),
  };
}
