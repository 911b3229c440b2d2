import { describe, expect, it } from 'vitest';
import {
  baselineModel, DEFAULT_LEARNER_SETTINGS, inputFrame, parseStoredModel, runBacktest, type LearnerSettings, type Series,
} from '../../src/engine';
import { MemoryWorkbook } from '../../src/host/memory-workbook';
import type { Reply } from '../../src/pane/jobs/protocol';
import { ensembleMember, runJob, testSpanStart, trainFraction } from '../../src/pane/jobs/run-job';
import { checkData } from '../../src/pane/logic/read-ranges';
import { historySheet } from './support';

const LINEAR: LearnerSettings = { ...DEFAULT_LEARNER_SETTINGS, kind: 'linear' };

async function series(days: number): Promise<Series> {
  const grid = historySheet(days);
  const port = new MemoryWorkbook({ sheets: { History: grid } });
  const n = grid.length;
  return (await checkData(port, { times: `History!A1:A${n}`, prices: `History!B1:B${n}`, drivers: [`History!C1:C${n}`] }, 'Europe/Berlin')).series;
}

function collect(job: Parameters<typeof runJob>[0]): Reply[] {
  const replies: Reply[] = [];
  runJob(job, (r) => replies.push(structuredClone(r)));
  return replies;
}

describe('trainFraction(what, done, total)', () => {
  it('maps the stages of a fit onto one bar', () => {
    expect(trainFraction('linear model', 1, 1)).toBe(0.05);
    expect(trainFraction('network epochs', 0, 100)).toBe(0.05);
    expect(trainFraction('network epochs', 100, 100)).toBeCloseTo(0.9, 12);
    expect(trainFraction('feature importance', 1, 1)).toBe(0.95);
    expect(trainFraction('forecast days', 3, 4)).toBe(0.75);
  });
});

describe('ensembleMember(done, iterations)', () => {
  it('splits the engine\'s epoch count across the ensemble into network and its own epoch', () => {
    expect(ensembleMember(5, 200)).toEqual({ network: 0, epoch: 5 });
    expect(ensembleMember(200, 200)).toEqual({ network: 0, epoch: 200 });
    expect(ensembleMember(201, 200)).toEqual({ network: 1, epoch: 1 });
    expect(ensembleMember(410, 200)).toEqual({ network: 2, epoch: 10 });
  });
});

describe('runJob(job, post)', () => {
  it('train: each validation loss says which network of the ensemble it belongs to, and that network\'s epochs start again', async () => {
    const s = await series(130);
    const settings: LearnerSettings = { ...DEFAULT_LEARNER_SETTINGS, kind: 'neural', network: { ...DEFAULT_LEARNER_SETTINGS.network, hiddenLayers: [4], iterations: 30, ensemble: 2 } };
    const losses = collect({ type: 'train', series: s, settings, name: 'n' })
      .filter((r): r is Extract<Reply, { type: 'progress' }> => r.type === 'progress' && r.loss !== undefined);
    expect(new Set(losses.map((r) => r.network))).toEqual(new Set([0, 1]));
    const second = losses.filter((r) => r.network === 1);
    expect(second[0].epoch).toBeLessThanOrEqual(30);
    expect(second.every((r) => r.done === 30 + r.epoch!)).toBe(true);
  });

  it('train: posts progress, then one trained reply whose text passes the stored-model schema', async () => {
    const s = await series(130);
    const replies = collect({ type: 'train', series: s, settings: LINEAR, name: 'main' });
    const last = replies[replies.length - 1];
    expect(last.type).toBe('trained');
    expect(replies.slice(0, -1).every((r) => r.type === 'progress')).toBe(true);
    const fractions = replies.filter((r) => r.type === 'progress').map((r) => (r as { fraction: number }).fraction);
    expect(fractions[fractions.length - 1]).toBe(1);
    expect(fractions.every((f, i) => i === 0 || f >= fractions[i - 1])).toBe(true);
    const stored = parseStoredModel((last as { text: string }).text);
    expect(stored.name).toBe('main');
    expect(stored.settings.kind).toBe('linear');
    expect(stored.setup.drivers).toEqual(['load forecast']);
    expect(stored.zone).toBe('Europe/Berlin');
  });

  it('train: a user error becomes one failed reply with its one-line message', async () => {
    const s = await series(20);
    const replies = collect({ type: 'train', series: s, settings: LINEAR, name: 'main' });
    expect(replies).toEqual([{ type: 'failed', message: expect.stringMatching(/^model linear needs at least 28 days of price history; the data has 19/) }]);
  });

  it('backtest: scores the learned model and both baselines on the same periods; baselines match runBacktest', async () => {
    const s = await series(130);
    const replies = collect({ type: 'backtest', series: s, settings: LINEAR, label: 'main', days: 14 });
    const last = replies[replies.length - 1];
    expect(last.type).toBe('backtested');
    const outcome = (last as Extract<Reply, { type: 'backtested' }>).outcome;
    expect(outcome.summaries.map((x) => x.model)).toEqual(['main', 'naive-week', 'weekday-rule']);
    const frame = inputFrame(s);
    const { testStart } = testSpanStart(frame, 14);
    expect(outcome.testStart).toBe(testStart);
    const direct = runBacktest(baselineModel('weekday-rule'), frame, s, { testStart, testEnd: outcome.testEnd });
    expect(outcome.summaries[2].mae).toBe(direct.summary.mae);
    expect(outcome.rows.length).toBe(direct.rows.length);
    expect(outcome.rows.map((r) => r.weekdayRule)).toEqual(direct.rows.map((r) => r.forecast));
    expect(outcome.rows.every((r) => Number.isFinite(r.forecast))).toBe(true);
    expect(outcome.summaries[1].rmae).toBeCloseTo(1, 12);
  });

  it('backtest: refuses a span that leaves no history', async () => {
    const s = await series(20);
    const replies = collect({ type: 'backtest', series: s, settings: null, label: 'x', days: 19 });
    expect(replies[replies.length - 1]).toEqual({ type: 'failed', message: expect.stringMatching(/leaves \d+ days of history/) });
  });
});
