import { fileURLToPath } from 'node:url';
import { generateCustomFunctionsMetadata } from 'custom-functions-metadata';
import { beforeAll, describe, expect, it } from 'vitest';
import * as loom from '../../src/functions/functions';

// The metadata the build writes to dist/functions.json, made by the same
// generator that custom-functions-metadata-plugin runs (webpack.config.js).
const source = fileURLToPath(new URL('../../src/functions/functions.ts', import.meta.url));

interface Parameter { name: string; description?: string; type: string; dimensionality?: string; optional?: boolean }
interface Fn { id: string; name: string; description?: string; parameters: Parameter[]; result: { type?: string; dimensionality?: string } }

let functions: Fn[];
let associate: { functionName: string; id: string }[];

beforeAll(async () => {
  const result = await generateCustomFunctionsMetadata(source, false);
  expect(result.errors).toEqual([]);
  functions = JSON.parse(result.metadataJson).functions;
  associate = result.associate;
}, 60_000);

const params = (id: string) => functions.find((f) => f.id === id)!.parameters.map((p) => (p.optional ? `[${p.name}]` : p.name));

describe('functions.json', () => {
  it('lists the eight LOOM functions of design.md', () => {
    expect(functions.map((f) => f.id).sort()).toEqual(['AHEAD', 'BAND', 'BASELINE', 'COMPARE', 'EXPLAIN', 'HOLIDAY', 'MODEL', 'SCORE']);
  });

  it('gives each function the parameters of the design.md table', () => {
    expect(params('AHEAD')).toEqual(['model', 'times', 'prices', '[driverTimes]', '[drivers]']);
    expect(params('BAND')).toEqual(['model', 'times', 'prices', '[driverTimes]', '[drivers]', '[coverage]']);
    expect(params('BASELINE')).toEqual(['times', 'prices', '[kind]', '[zone]']);
    expect(params('SCORE')).toEqual(['actual', 'forecast', '[metric]', '[reference]']);
    expect(params('COMPARE')).toEqual(['actual', 'forecastA', 'forecastB', '[loss]', '[days]']);
    expect(params('HOLIDAY')).toEqual(['date', 'region']);
    expect(params('MODEL')).toEqual(['model', '[field]']);
    expect(params('EXPLAIN')).toEqual(['model', 'times', 'prices', '[driverTimes]', '[drivers]', '[against]']);
  });

  it('has help text for every function and every parameter', () => {
    for (const f of functions) {
      expect(f.description, f.id).toMatch(/\w{3}.*\w/);
      for (const p of f.parameters) expect(p.description, `${f.id}.${p.name}`).toMatch(/\w{3}/);
    }
  });

  it('takes ranges as any-typed matrices, so empty cells reach us as empty, not as 0', () => {
    for (const f of functions) {
      for (const p of f.parameters.filter((q) => ['times', 'prices', 'driverTimes', 'drivers', 'actual', 'forecast', 'forecastA', 'forecastB', 'reference', 'days'].includes(q.name))) {
        expect([p.type, p.dimensionality], `${f.id}.${p.name}`).toEqual(['any', 'matrix']);
      }
    }
  });

  it('spills matrices from AHEAD, BAND, BASELINE, MODEL and EXPLAIN; SCORE and COMPARE give a number, HOLIDAY text', () => {
    const result = (id: string) => functions.find((f) => f.id === id)!.result;
    for (const id of ['AHEAD', 'BAND', 'BASELINE', 'MODEL', 'EXPLAIN']) expect(result(id).dimensionality, id).toBe('matrix');
    expect(result('SCORE').type).toBe('number');
    expect(result('COMPARE').type).toBe('number');
    expect(result('HOLIDAY').type).toBe('string');
  });

  it('associates each id with a function functions.ts exports', () => {
    for (const a of associate) expect(typeof (loom as Record<string, unknown>)[a.functionName], a.id).toBe('function');
    expect(associate).toHaveLength(8);
  });
});
