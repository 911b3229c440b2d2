/**
 * The host's custom-functions runtime provides a global `CustomFunctions`
 * (associate, Error, ErrorCode). Outside the host (the standalone preview,
 * Node tests) there is none, yet the build appends
 * `CustomFunctions.associate(...)` calls to functions.ts; this module, which
 * functions.ts imports first, puts a small stand-in in its place that records
 * the associations, so the preview can look the functions up by id.
 */
export interface CustomFunctionsApi {
  associate(id: string, fn: (...args: never[]) => unknown): void;
  Error: new (code: string, message?: string) => Error & { code: string };
  ErrorCode: {
    invalidValue: string;
    notAvailable: string;
    divisionByZero: string;
    invalidNumber: string;
    nullReference: string;
    invalidName: string;
    invalidReference: string;
  };
}

const registry = new Map<string, (...args: never[]) => unknown>();

class CellError extends Error {
  constructor(readonly code: string, message?: string) {
    super(message ?? code);
    this.name = 'CellError';
  }
}

const standIn: CustomFunctionsApi = {
  associate: (id, fn) => void registry.set(id.toUpperCase(), fn),
  Error: CellError,
  ErrorCode: {
    invalidValue: '#VALUE!', notAvailable: '#N/A', divisionByZero: '#DIV/0!', invalidNumber: '#NUM!',
    nullReference: '#NULL!', invalidName: '#NAME?', invalidReference: '#REF!',
  },
};

const scope = globalThis as { CustomFunctions?: Partial<CustomFunctionsApi> };
// office.js outside a host leaves a bare CustomFunctions (associate only): complete what is missing
if (!scope.CustomFunctions) scope.CustomFunctions = standIn;
else {
  scope.CustomFunctions.Error ??= standIn.Error;
  scope.CustomFunctions.ErrorCode ??= standIn.ErrorCode;
}

/** The host's runtime, or the stand-in. */
export function customFunctionsApi(): CustomFunctionsApi {
  return (scope.CustomFunctions as CustomFunctionsApi | undefined) ?? standIn;
}

/** Functions associated with the stand-in, by id (AHEAD, BAND, ...); empty inside the host. */
export function associatedFunctions(): ReadonlyMap<string, (...args: never[]) => unknown> {
  return registry;
}
