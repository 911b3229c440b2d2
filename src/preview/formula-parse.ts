import { InputError } from '../engine';
import { parseA1, type A1Range } from '../host/a1';

/**
 * The formulas the preview grid understands, and nothing more (no general
 * formula engine): a LOOM function call, a plain reference, or a literal.
 *
 *   formula   = "=" expr
 *   expr      = ["-" | "+"] ( number | text | TRUE | FALSE | call | reference | "(" expr ")" )
 *   call      = "LOOM." NAME "(" [arg] { "," [arg] } ")"      an empty arg is omitted
 *   reference = [sheet "!"] cell [":" cell]                    cell = $?COL$?ROW, A1 style
 *   sheet     = NAME | "'" any text with '' for ' "'"
 *   text      = '"' any text with "" for " '"'
 *
 * Names are read without regard to case, as spreadsheets do. Anything
 * else (arithmetic, other functions) is refused with a message.
 *
 * @throws InputError naming what could not be read
 * @example parseFormula('=LOOM.SCORE(History!B2:B9, History!C2:C9, "MAE")').kind // 'call'
 */
export type FormulaNode =
  | { kind: 'number'; value: number }
  | { kind: 'text'; value: string }
  | { kind: 'bool'; value: boolean }
  | { kind: 'ref'; range: A1Range; text: string }
  | { kind: 'call'; name: string; args: (FormulaNode | null)[] }
  | { kind: 'neg'; arg: FormulaNode };

const CELL = /^\$?[A-Za-z]{1,3}\$?\d{1,7}/;
const NUMBER = /^(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?/;
const NAME = /^[A-Za-z_][A-Za-z0-9_.]*/;

export function parseFormula(formula: string): FormulaNode {
  if (!formula.startsWith('=')) throw new InputError('a formula starts with =');
  const p = new Parser(formula.slice(1));
  p.space();
  const node = p.expr();
  p.space();
  if (!p.done()) throw p.fail('unexpected text');
  return node;
}

class Parser {
  private i = 0;
  constructor(private readonly s: string) {}

  done(): boolean {
    return this.i >= this.s.length;
  }

  space(): void {
    while (this.i < this.s.length && /\s/.test(this.s[this.i])) this.i++;
  }

  fail(what: string): InputError {
    const near = this.s.slice(this.i, this.i + 16);
    return new InputError(`cannot read the formula: ${what}${near ? ` at "${near}"` : ' at its end'} (the preview knows LOOM functions, references like History!A2:A900, numbers and "text")`);
  }

  expr(): FormulaNode {
    this.space();
    const c = this.s[this.i];
    if (c === '-' || c === '+') {
      this.i++;
      const arg = this.expr();
      return c === '-' ? (arg.kind === 'number' ? { kind: 'number', value: -arg.value } : { kind: 'neg', arg }) : arg;
    }
    if (c === '(') {
      this.i++;
      const inner = this.expr();
      this.space();
      if (this.s[this.i] !== ')') throw this.fail('missing )');
      this.i++;
      return inner;
    }
    if (c === '"') return { kind: 'text', value: this.quoted('"') };
    const rest = this.s.slice(this.i);
    const num = NUMBER.exec(rest);
    if (num && !CELL.test(rest)) {
      this.i += num[0].length;
      return { kind: 'number', value: Number(num[0]) };
    }
    if (c === "'") return this.reference(this.quoted("'"));
    const name = NAME.exec(rest);
    if (name || c === '$') {
      const word = name?.[0] ?? '';
      const after = this.s[this.i + word.length];
      if (word && after === '!') { this.i += word.length; return this.reference(word); }
      if (word && this.peekParen(word.length)) return this.call(word);
      if (CELL.test(rest)) return this.reference(undefined);
      if (/^(TRUE|FALSE)$/i.test(word)) { this.i += word.length; return { kind: 'bool', value: word.toUpperCase() === 'TRUE' }; }
      throw this.fail(`unknown name "${word}"`);
    }
    throw this.fail('expected a value');
  }

  private peekParen(offset: number): boolean {
    let j = this.i + offset;
    while (j < this.s.length && /\s/.test(this.s[j])) j++;
    return this.s[j] === '(';
  }

  private call(word: string): FormulaNode {
    const upper = word.toUpperCase();
    if (!upper.startsWith('LOOM.') || upper.length === 5) {
      throw new InputError(`the preview evaluates only LOOM functions and references, not ${word}(…)`);
    }
    this.i += word.length;
    this.space();
    this.i++; // (
    const args: (FormulaNode | null)[] = [];
    this.space();
    if (this.s[this.i] === ')') { this.i++; return { kind: 'call', name: upper.slice(5), args }; }
    for (;;) {
      this.space();
      const c = this.s[this.i];
      args.push(c === ',' || c === ')' ? null : this.expr());
      this.space();
      const sep = this.s[this.i];
      if (sep === ',') { this.i++; continue; }
      if (sep === ')') { this.i++; break; }
      throw this.fail('expected , or )');
    }
    return { kind: 'call', name: upper.slice(5), args };
  }

  /** Reads the cells of a reference at the cursor; `sheet` has been read already (the ! is next). */
  private reference(sheet: string | undefined): FormulaNode {
    if (sheet !== undefined) {
      if (this.s[this.i] !== '!') throw this.fail('expected ! after the sheet name');
      this.i++;
    }
    const first = CELL.exec(this.s.slice(this.i));
    if (!first) throw this.fail('expected a cell such as A1');
    this.i += first[0].length;
    let cells = first[0];
    if (this.s[this.i] === ':') {
      const second = CELL.exec(this.s.slice(this.i + 1));
      if (!second) throw this.fail('expected a cell after :');
      this.i += 1 + second[0].length;
      cells += `:${second[0]}`;
    }
    const range = parseA1(cells);
    const text = sheet === undefined ? cells : `${sheet}!${cells}`;
    return { kind: 'ref', range: { ...range, sheet }, text };
  }

  private quoted(q: string): string {
    this.i++; // opening quote
    let out = '';
    for (;;) {
      if (this.i >= this.s.length) throw this.fail(`missing closing ${q}`);
      const c = this.s[this.i++];
      if (c === q) {
        if (this.s[this.i] === q) { out += q; this.i++; continue; }
        return out;
      }
      out += c;
    }
  }
}
