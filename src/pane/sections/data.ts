import { checkZone, holidaysOfYear, InputError, prepareHolidays } from '../../engine';
import type { PaneContext } from '../context';
import { clear, field, guarded, h, messageLine } from '../dom';
import { checkData, splitAddresses } from '../logic/read-ranges';

/** A few market zones offered in the zone box; any IANA name can be typed. */
export const ZONE_CHOICES = [
  'Europe/Berlin', 'Europe/Amsterdam', 'Europe/Paris', 'Europe/Madrid', 'Europe/Rome', 'Europe/Vienna', 'Europe/Warsaw',
  'Europe/Prague', 'Europe/Oslo', 'Europe/Stockholm', 'Europe/Helsinki', 'Europe/London', 'Europe/Dublin', 'Europe/Lisbon',
  'Australia/Adelaide', 'Australia/Sydney', 'Australia/Brisbane', 'America/New_York', 'America/Chicago', 'America/Los_Angeles', 'Asia/Tokyo',
];

/**
 * Data: where the history is. The user picks the timestamp, price and
 * driver ranges (from the selection or by address), the market's time zone
 * and holiday region, and checks what was found before anything trains.
 */
export function dataSection(ctx: PaneContext): HTMLElement {
  const { store, port } = ctx;
  const s = store.get();
  const message = messageLine('data-message');
  const report = h('ul', { class: 'loom-report', test: 'data-report' });

  const times = h('input', { type: 'text', test: 'times-address', value: s.choice.times, placeholder: 'History!A2:A900' });
  const prices = h('input', { type: 'text', test: 'prices-address', value: s.choice.prices, placeholder: 'History!B2:B900' });
  const drivers = h('input', { type: 'text', test: 'drivers-address', value: s.choice.drivers.join(', '), placeholder: 'History!C2:D900 (optional)' });
  const zone = h('input', { type: 'text', test: 'zone', value: s.zone, list: 'loom-zones' });
  const region = h('input', { type: 'text', test: 'region', value: s.region, placeholder: 'e.g. DE or DE-BY' });
  const zones = h('datalist', { id: 'loom-zones' }, ...ZONE_CHOICES.map((z) => h('option', { value: z })));

  const choiceNow = () => ({ times: times.value.trim(), prices: prices.value.trim(), drivers: splitAddresses(drivers.value) });
  const changed = () => {
    store.set({ choice: choiceNow(), zone: zone.value.trim(), region: region.value.trim(), data: undefined });
    clear(report);
    message.info('The ranges changed: check the data again before training.');
  };
  for (const input of [times, prices, drivers, zone, region]) input.addEventListener('change', changed);

  const useSelection = (input: HTMLInputElement, test: string) => {
    const button = h('button', { class: 'loom-button loom-button-small', type: 'button', test, text: 'use selection' });
    button.addEventListener('click', () => guarded(button, message, async () => {
      input.value = await port.selectedAddress();
      changed();
      message.clear();
    }));
    return button;
  };

  const check = h('button', { class: 'loom-button loom-button-main', type: 'button', test: 'check-data-button', text: 'Check data' });
  check.addEventListener('click', () => guarded(check, message, async () => {
    clear(report);
    store.set({ choice: choiceNow(), zone: zone.value.trim() || 'Europe/Berlin', region: region.value.trim(), data: undefined });
    const st = store.get();
    checkZone(st.zone);
    if (st.region) {
      try {
        await prepareHolidays(st.region); // the region's rules load on first use
        holidaysOfYear(2025, st.region);
      } catch {
        throw new InputError(`"${st.region}" is not a holiday region the calendar knows; use a code such as DE, FR, DE-BY or AU-SA, or leave it empty`);
      }
    }
    message.info('Reading the ranges…');
    const data = await checkData(port, st.choice, st.zone);
    store.set({ data });
    for (const line of data.lines) report.appendChild(h('li', { text: line }));
    const names = data.layout.driverNames;
    report.appendChild(h('li', { text: names.length ? `drivers: ${names.join(', ')}` : 'no driver columns: models learn from prices and the calendar alone' }));
    if (data.firstOpenRow !== undefined) report.appendChild(h('li', { text: `rows from sheet row ${data.firstOpenRow} on have no price yet: those are the days to forecast` }));
    else report.appendChild(h('li', { text: 'every row has a price: add tomorrow\'s rows (timestamps and driver forecasts, price empty) to forecast it' }));
    message.ok('Data checked. Train a model next, or check a saved one.');
  }));

  return h('section', { class: 'loom-section', test: 'section-data', data: { section: 'data' } },
    h('h2', { text: 'Data' }),
    h('p', { class: 'loom-intro', text: 'Pick the price history: one column of delivery-period starts, one of prices, and any known-ahead drivers (forecasts of load, temperature, wind, solar, fuel) on the same rows. A first row with column names is recognised.' }),
    field('Timestamps', times, 'Start of each delivery period: spreadsheet dates in market time, or text like 2025-03-30T03:00:00+02:00.', useSelection(times, 'times-use-selection')),
    field('Prices', prices, 'Price per MWh; may be negative; leave tomorrow\'s cells empty.', useSelection(prices, 'prices-use-selection')),
    field('Drivers', drivers, 'Optional. One range with several columns, or several ranges separated by commas.', useSelection(drivers, 'drivers-use-selection')),
    field('Market time zone', zone, 'A delivery day is a calendar day in this zone (IANA name), so it has 23, 24 or 25 hours.'),
    zones,
    field('Holiday region', region, 'Optional. Public holidays of this region become model inputs, e.g. DE, FR, DE-BY.'),
    h('div', { class: 'loom-actions' }, check),
    message.el,
    report,
  );
}
