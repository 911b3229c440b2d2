// The part of fast-formula-parser (MIT, https://github.com/LesterLyu/fast-formula-parser)
// that the preview uses; the package ships no type declarations.
declare module 'fast-formula-parser' {
  /** 1-based cell position, as the library counts */
  export interface CellRef { sheet?: string; row: number; col: number }
  export interface RangeRef { sheet?: string; from: { row: number; col: number }; to: { row: number; col: number } }
  /** one argument as a custom function receives it */
  export interface FunctionArg {
    value: unknown;
    isArray?: boolean;
    isRangeRef?: boolean;
    isCellRef?: boolean;
    omitted?: boolean;
  }
  export interface ParserConfig {
    functions?: Record<string, (...args: FunctionArg[]) => unknown>;
    onCell?: (ref: CellRef) => unknown;
    onRange?: (ref: RangeRef) => unknown[][];
  }
  export class FormulaError extends Error {
    constructor(error: string, message?: string, details?: unknown);
    readonly error: string;
    readonly details?: unknown;
  }
  export class DepParser {
    constructor(config?: { onVariable?: () => null });
    parse(formula: string, position: CellRef): (CellRef | RangeRef)[];
  }
  export default class FormulaParser {
    static DepParser: typeof DepParser;
    static FormulaError: typeof FormulaError;
    constructor(config?: ParserConfig);
    parseAsync(formula: string, position: CellRef, allowReturnArray?: boolean): Promise<unknown>;
  }
}
