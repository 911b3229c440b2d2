import { OfficeMockObject } from 'office-addin-mock';
import { formatA1, parseA1 } from '../../src/host/a1';
import type { CellValue } from '../../src/host/workbook-port';

/**
 * A small stand-in for the host's Excel API, built on office-addin-mock's
 * OfficeMockObject where it fits: a range's `values`, `formulas` and
 * `address`, a function result's `value` and a null object's `isNullObject`
 * read as errors until they are loaded and synced, so the adapter must load
 * what it reads. Collections and custom XML parts are plain objects whose
 * contents arrive at `context.sync()`, as batched requests do; writes and
 * deletions also take effect at sync. Cells are kept as the host gives them
 * ('' for empty).
 */
export interface FakePart {
  id: string;
  xml: string;
}

export interface FakeExcel {
  Excel: unknown;
  sheets: Map<string, Map<string, CellValue>>;
  parts: FakePart[];
  charts: { sheet: string; type: string; address: string; seriesBy: string; title: string; name?: string }[];
  syncs: number;
  calculations: string[];
  requests: { address: string; cells: number }[];
  /** number formats written, by 'Sheet!A1' */
  formats: Map<string, string>;
}

export function fakeExcel(init: {
  sheets?: Record<string, CellValue[][]>; parts?: FakePart[]; dateSystem?: '1900' | '1904'; selection?: string;
  /** formula cell → the range it spills into, e.g. { 'Outlook!B13': 'Outlook!B13:B36' } (the host's dynamic arrays, from memory) */
  spills?: Record<string, string>;
} = {}): FakeExcel {
  const state: FakeExcel = { Excel: undefined, sheets: new Map(), parts: [...(init.parts ?? [])], charts: [], syncs: 0, calculations: [], requests: [], formats: new Map() };
  for (const [name, grid] of Object.entries(init.sheets ?? { Sheet1: [] })) {
    const cells = new Map<string, CellValue>();
    grid.forEach((row, r) => row.forEach((v, c) => v !== null && v !== '' && cells.set(`${r},${c}`, v)));
    state.sheets.set(name, cells);
  }
  const tracked: OfficeMockObject[] = [];
  const addresses = new WeakMap<object, string>(); // what the host knows about a range without a load
  const atSync: (() => void)[] = [];
  let failure: Error | undefined;
  let partIds = state.parts.length;
  const track = <T extends OfficeMockObject>(o: T) => (tracked.push(o), o);
  const sheetName = (name: string) => [...state.sheets.keys()].find((k) => k.toLowerCase() === name.toLowerCase());
  const notFound = (what: string) => Object.assign(new Error(`${what} was not found`), { code: 'ItemNotFound' });

  const range = (sheet: string | undefined, address: string) => {
    const r = parseA1(address);
    const cells = sheet ? state.sheets.get(sheet) : undefined;
    if (!cells) failure ??= notFound(`sheet ${sheet}`);
    const grid = Array.from({ length: r.rows }, (_, i) => Array.from({ length: r.columns }, (_, j) => cells?.get(`${r.row + i},${r.column + j}`) ?? ''));
    const values = grid.map((row) => row.map((v) => (typeof v === 'string' && v.startsWith('=') ? 0 : v)));
    const mock = track(new OfficeMockObject({ address: formatA1({ ...r, sheet }), values, formulas: grid }));
    (mock as unknown as { getSpillingToRangeOrNullObject(): unknown }).getSpillingToRangeOrNullObject = () => {
      const to = init.spills?.[formatA1({ ...r, sheet })];
      return track(new OfficeMockObject({ address: to ?? '', isNullObject: to === undefined }));
    };
    state.requests.push({ address: formatA1({ ...r, sheet }), cells: r.rows * r.columns });
    addresses.set(mock, formatA1({ ...r, sheet }));
    atSync.push(() => {
      const numberFormat = (mock as unknown as { numberFormat?: unknown }).numberFormat;
      if (Array.isArray(numberFormat)) {
        (numberFormat as string[][]).forEach((row, i) => row.forEach((f, j) => state.formats.set(formatA1({ sheet, row: r.row + i, column: r.column + j, rows: 1, columns: 1 }), f)));
      }
      const written = (mock as unknown as { formulas: unknown }).formulas;
      if (written !== grid && Array.isArray(written) && cells) {
        (written as CellValue[][]).forEach((row, i) => row.forEach((v, j) => {
          const key = `${r.row + i},${r.column + j}`;
          if (v === '' || v === null) cells.delete(key); else cells.set(key, v);
        }));
      }
    });
    return mock;
  };

  const worksheet = (name: string | undefined) => ({
    getRange: (address: string) => range(name, address),
    // the host's used range starts at the first used cell, not at A1
    getUsedRangeOrNullObject: () => {
      const keys = [...(state.sheets.get(name ?? '')?.keys() ?? [])].map((k) => k.split(',').map(Number));
      if (keys.length === 0) return track(new OfficeMockObject({ address: '', isNullObject: true }));
      const top = Math.min(...keys.map((k) => k[0])), left = Math.min(...keys.map((k) => k[1]));
      const bottom = Math.max(...keys.map((k) => k[0])), right = Math.max(...keys.map((k) => k[1]));
      return track(new OfficeMockObject({ address: formatA1({ sheet: name, row: top, column: left, rows: bottom - top + 1, columns: right - left + 1 }), isNullObject: false }));
    },
    charts: {
      add: (type: string, source: object, seriesBy: string) => {
        const chart = { title: { text: '' }, name: undefined as string | undefined };
        atSync.push(() => state.charts.push({ sheet: name!, type, address: addresses.get(source)!, seriesBy, title: chart.title.text, ...(chart.name ? { name: chart.name } : {}) }));
        return chart;
      },
      getItemOrNullObject: (chartName: string) => {
        const found = () => state.charts.find((c) => c.sheet === name && c.name === chartName);
        const item = {
          isNullObject: true,
          load: () => atSync.push(() => { item.isNullObject = !found(); }),
          delete: () => atSync.push(() => { const c = found(); if (c) state.charts.splice(state.charts.indexOf(c), 1); }),
        };
        return item;
      },
    },
  });

  const parts = {
    add: (xml: string) => atSync.push(() => state.parts.push({ id: `part-${++partIds}`, xml })),
    getByNamespace: (ns: string) => {
      const collection = {
        items: [] as unknown[],
        load: () => atSync.push(() => {
          collection.items = state.parts.filter((p) => p.xml.includes(`xmlns="${ns}"`) || p.xml.includes(`="${ns}"`)).map((p) => ({
            id: p.id,
            getXml: () => {
              const result = { value: undefined as string | undefined };
              atSync.push(() => (result.value = p.xml));
              return result;
            },
            setXml: (xml: string) => atSync.push(() => (p.xml = xml)),
            delete: () => atSync.push(() => state.parts.splice(state.parts.indexOf(p), 1)),
          }));
        }),
      };
      return collection;
    },
  };

  const context = {
    workbook: {
      functions: { date: (y: number) => track(new OfficeMockObject({ value: y === 1904 && init.dateSystem === '1904' ? 0 : 1462 })) },
      getSelectedRange: () => {
        const sel = parseA1(init.selection ?? 'Sheet1!A1');
        return range(sheetName(sel.sheet ?? 'Sheet1'), formatA1({ ...sel, sheet: undefined }));
      },
      worksheets: {
        items: [] as { name: string }[],
        load(this: { items: { name: string }[] }) { atSync.push(() => (this.items = [...state.sheets.keys()].map((name) => ({ name })))); },
        getItem: (name: string) => worksheet(sheetName(name) ?? (failure ??= notFound(`sheet ${name}`), undefined)),
        getActiveWorksheet: () => worksheet([...state.sheets.keys()][0]),
        getItemOrNullObject: (name: string) => track(new OfficeMockObject({ isNullObject: sheetName(name) === undefined })),
        add: (name: string) => atSync.push(() => state.sheets.set(name, new Map())),
      },
      customXmlParts: parts,
      application: { calculate: (type: string) => atSync.push(() => state.calculations.push(type)) },
    },
    sync: async () => {
      state.syncs++;
      for (const o of tracked.splice(0)) await o.sync();
      for (const f of atSync.splice(0)) f();
      if (failure) { const f = failure; failure = undefined; throw f; }
    },
  };
  state.Excel = new OfficeMockObject({ run: async (batch: (c: typeof context) => Promise<unknown>) => batch(context) });
  return state;
}
