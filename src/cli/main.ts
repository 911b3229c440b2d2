import { Command, CommanderError, Option } from 'commander';
import { InputError } from '../engine';
import { backtestCommand } from './commands/backtest';
import { demoCommand } from './commands/demo';
import { explainCommand } from './commands/explain';
import { forecastCommand } from './commands/forecast';
import { scoreCommand } from './commands/score';
import { trainCommand } from './commands/train';
import { addModelFlags } from './model-flags';

const MODELS = ['blend', 'neural', 'linear', 'lear', 'naive-day', 'naive-week', 'weekday-rule'];

/**
 * The `spotloom` command line. Returns the exit code: 0 success, 2 bad
 * input (one clear line on stderr, never a stack trace), 1 an internal fault.
 */
export async function main(argv: string[]): Promise<number> {
  const program = new Command('spotloom')
    .description('Day-ahead electricity price forecasts, baselines and error scores from a CSV file.')
    .exitOverride()
    .configureOutput({ writeErr: (s) => process.stderr.write(s) })
    .showHelpAfterError('(spotloom --help lists the commands)');

  const zone = () => new Option('--tz <zone>', 'market time zone (IANA)').default('Europe/Berlin');
  const missing = () => new Option('--missing <rule>', 'prices missing inside the history: fill (same period of the nearest earlier day) or fail')
    .choices(['fill', 'fail']).default('fill');
  // the data file's dialect: detected unless given (engine/series/csv-dialect.ts)
  const delimiter = () => new Option('--delimiter <sep>', 'cell separator of the data files: , or ; or tab (default: detected)');
  const decimal = () => new Option('--decimal <mark>', 'decimal mark of the data files: . or , (default: detected; , only with ; or tab)');
  addModelFlags(program.command('backtest')
    .description('walk forward through a test span, forecasting each day from data before it')
    .requiredOption('--input <file>', 'CSV with timestamp, price and driver columns')
    .requiredOption('--test-start <date>', 'first delivery day to forecast (YYYY-MM-DD)')
    .option('--test-end <date>', 'last delivery day to forecast (YYYY-MM-DD)')
    .addOption(new Option('--model <name>', 'model').choices(MODELS).default('blend'))
    .option('--retrain-every <days>', 'refresh the model every this many days (0 = never; default 1 for blend, linear and lear: the linear parts take in every day and the blend\'s networks warm-start weekly; 7 for neural)')
    .addOption(zone()).addOption(missing()).addOption(delimiter()).addOption(decimal())
    .option('--out <file>', 'write timestamp,forecast,lower,upper,actual')
    .option('--json', 'print one JSON summary on stdout'))
    .action(async (o) => backtestCommand(o));

  addModelFlags(program.command('train')
    .description('train a model on the history and save it')
    .requiredOption('--input <file>', 'CSV with timestamp, price and driver columns')
    .option('--until <date>', 'train on delivery days before this date (YYYY-MM-DD)')
    .requiredOption('--save <file>', 'model file to write (JSON)')
    .addOption(new Option('--model <name>', 'model').choices(['blend', 'neural', 'linear']).default('blend'))
    .addOption(zone()).addOption(missing()).addOption(delimiter()).addOption(decimal())
    .option('--json', 'print one JSON summary on stdout'))
    .action(async (o) => trainCommand(o));

  program.command('forecast')
    .description('forecast the delivery day(s) after the last known price')
    .requiredOption('--model <file>', 'model file saved by train')
    .requiredOption('--input <file>', 'CSV: history with prices (then, without --drivers, the forecast day\'s rows with drivers and an empty price)')
    .option('--drivers <file>', 'CSV with the forecast day\'s driver rows: timestamp and the history\'s driver columns, no price')
    .addOption(delimiter()).addOption(decimal())
    .option('--out <file>', 'write timestamp,forecast,lower,upper')
    .option('--json', 'print the forecast as JSON on stdout')
    .action(async (o) => forecastCommand(o));

  program.command('explain')
    .description('split the change of the next day\'s mean forecast against the model\'s forecast of D-1 or D-7 into one contribution per input group')
    .requiredOption('--model <file>', 'model file saved by train')
    .requiredOption('--input <file>', 'CSV: history with prices (then, without --drivers, the forecast day\'s rows with drivers and an empty price)')
    .option('--drivers <file>', 'CSV with the forecast day\'s driver rows: timestamp and the history\'s driver columns, no price')
    .addOption(new Option('--against <day>', 'reference day: d-1 (the day before) or d-7 (a week before)').choices(['d-1', 'd-7']).default('d-1'))
    .option('--tz <zone>', 'market time zone (IANA); must be the model\'s, which is used when left out')
    .addOption(delimiter()).addOption(decimal())
    .option('--sensitivity', 'also print the forecast change per unit of each driver')
    .option('--json', 'print the explanation as JSON on stdout')
    .action(async (o) => explainCommand(o));

  program.command('score')
    .description('grade forecast columns against the actual prices')
    .requiredOption('--input <file>', 'CSV with timestamp, actual and forecast columns')
    .option('--actuals <file>', 'take the actual column from this data file\'s price column, matched on timestamp (for a file that forecast --out wrote)')
    .option('--against <column>', 'reference column for rMAE and the Diebold-Mariano test')
    .option('--season <periods>', 'seasonal lag of the MASE scale in periods (default: one day)')
    .addOption(zone()).addOption(delimiter()).addOption(decimal())
    .option('--json', 'print one JSON object on stdout')
    .action(async (o) => scoreCommand(o));

  program.command('demo')
    .description('write the invented demo market (history, the next day\'s drivers and prices) and backtest the models on it')
    .option('--out <dir>', 'folder for the demo files', 'spotloom-demo')
    .action(async (o) => demoCommand(o));

  try {
    await program.parseAsync(argv, { from: 'user' });
    return 0;
  } catch (err) {
    return report(err);
  }
}

function report(err: unknown): number {
  if (err instanceof CommanderError) {
    // commander has already printed its message; help and version are not failures
    return err.code === 'commander.helpDisplayed' || err.code === 'commander.version' || err.exitCode === 0 ? 0 : 2;
  }
  if (err instanceof InputError) {
    process.stderr.write(`spotloom: ${err.message}\n`);
    return 2;
  }
  const message = err instanceof Error ? err.message : String(err);
  process.stderr.write(`spotloom: internal error: ${message}\n`);
  if (process.env.SPOTLOOM_DEBUG && err instanceof Error) process.stderr.write(`${err.stack}\n`);
  return 1;
}
