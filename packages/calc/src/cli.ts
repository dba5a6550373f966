import { readFileSync } from 'node:fs';
import { runAcSweep } from './ac.ts';
import { cornersReport, mcReport, opReport } from './cli-report.ts';
import { solveOperatingPoint } from './dc.ts';
import type { ParsedDeck } from './deck-parse.ts';
import { parseDeck } from './deck-parse.ts';
import { isEngineError } from './errors.ts';
import { parseValue } from './values.ts';
import { runCorners } from './variation/corners.ts';
import { runMonteCarlo } from './variation/monte-carlo.ts';
import { parseToleranceArgument } from './variation/tolerance-argument.ts';

/**
 * The `biasproof` command: reads a SPICE deck, runs the engine and prints JSON for scripts.
 * The only file of the engine that does I/O, and only through the `CliIo` it is given.
 */

export const usage = `Usage:
  biasproof op DECK [--temp C] [--quiet]
  biasproof ac DECK --probe NODE [--ref NODE] [--temp C] [--quiet]
  biasproof mc DECK --samples N --seed S --probe PATH --tol NAME=P% [--tol ...] [--temp C]
  biasproof corners DECK --probe PATH --tol NAME=P% [--tol ...] [--temp C]
  biasproof --help

Commands:
  op   Solve the bias point of DECK and print
       {"nodes":{name:V},"sources":{name:A},"devices":{name:{kind,region,...}}}
       diode: id vd rd; BJT: ic ib vbe vce gm rpi ro; MOSFET: id vgs vds gm gmb ro
       (volts, amperes, siemens, ohms; names lowercase; source current positive into +).
  ac   Run the deck's .ac sweep and print {"freq":[Hz],"db":[dB],"deg":[degrees]} of
       V(NODE) (minus V(--ref NODE) when given) per unit AC stimulus.
  mc   Monte Carlo of the bias point: N samples with every --tol parameter drawn from
       a normal distribution whose 3σ is P % of its value, and print
       {"samples":N,"failed":K,"mean":…,"sigma":…,"min":…,"max":…,"p00135":…,"p50":…,
       "p99865":…} of PATH over the samples that converged (failed ones are counted in
       "failed"). The same seed gives the same samples on any machine.
  corners  Every combination of the --tol parameters at their ends (±P %; with more than
       12 parameters a sensitivity-directed search) and print
       {"min":…,"max":…,"minAt":{NAME:value},"maxAt":{NAME:value}} of PATH.

Options:
  --probe NODE  node whose response "ac" prints (required for ac)
  --ref NODE    reference node of the response; default ground
  --probe PATH  (mc, corners) a result path: nodes.NODE, sources.V, devices.DEV.QTY
                (e.g. devices.q1.ic), elements.ELEM.current|power or supplyPower
  --tol NAME=P% (mc, corners) vary NAME by ±P %: an element (its value) or MODEL.PARAM
                (a model parameter, e.g. qn.bf=30%); repeat for each parameter
  --samples N   (mc) number of samples, 1 to 100000
  --seed S      (mc) seed of the random draws (any text or number)
  --temp C      circuit temperature in °C, overriding the deck's .temp (default 27)
  --quiet       do not print the deck's warnings on stderr
  -h, --help    show this text

Output: JSON on stdout. JSON has no infinity: an infinite value prints as null — ro of
a MOSFET in saturation with LAMBDA=0, or of any device whose output conductance is
exactly zero. (A BJT with VAF=0 keeps the tiny reverse-transport conductance of the
Gummel-Poon model, so its ro is huge but finite.)
Deck warnings (ignored cards and parameters) go to stderr.
Exit status: 0 done; 2 bad input (missing file, bad deck, unsolvable circuit, no .ac
card, unknown probe node or result path, bad --tol), with one line on stderr; 1 an
internal error.`;

/** Where the command reads and writes; the bin wrapper passes the process's own. */
export interface CliIo {
  readFile(path: string): string;
  stdout(text: string): void;
  stderr(text: string): void;
}

interface CliArgs {
  command?: string;
  deck?: string;
  probe?: string;
  ref?: string;
  temp?: number;
  samples?: number;
  seed?: string;
  tols: string[];
  quiet: boolean;
  help: boolean;
}

class UsageError extends Error {}

function parseArgs(argv: string[]): CliArgs {
  const args: CliArgs = { quiet: false, help: false, tols: [] };
  const positional: string[] = [];
  for (let i = 0; i < argv.length; i += 1) {
    const arg = argv[i] ?? '';
    const value = (): string => {
      const next = argv[i + 1];
      if (next === undefined || next.startsWith('--')) throw new UsageError(`${arg} needs a value`);
      i += 1;
      return next;
    };
    if (arg === '-h' || arg === '--help') args.help = true;
    else if (arg === '--quiet') args.quiet = true;
    // Kept as typed: result paths (mc, corners) are case-sensitive (supplyPower, betaDc).
    else if (arg === '--probe') args.probe = value();
    else if (arg === '--ref') args.ref = value().toLowerCase();
    else if (arg === '--temp') args.temp = parseValue(value(), { unit: '°C' });
    else if (arg === '--samples') args.samples = wholeNumber(arg, value());
    else if (arg === '--seed') args.seed = value();
    else if (arg === '--tol') args.tols.push(value());
    else if (arg.startsWith('-') && arg.length > 1 && !/^-\d/.test(arg))
      throw new UsageError(`unknown option ${arg}`);
    else positional.push(arg);
  }
  const [command, deck, extra] = positional;
  if (extra !== undefined) throw new UsageError(`unexpected argument '${extra}'`);
  return {
    ...args,
    ...(command === undefined ? {} : { command }),
    ...(deck === undefined ? {} : { deck }),
  };
}

function wholeNumber(option: string, text: string): number {
  if (!/^\d+$/.test(text)) throw new UsageError(`${option} needs a whole number, not '${text}'`);
  return Number(text);
}

function readDeck(path: string, io: CliIo): ParsedDeck {
  let text: string;
  try {
    text = io.readFile(path);
  } catch (error) {
    const code = (error as { code?: string }).code;
    const why =
      code === 'ENOENT'
        ? 'no such file'
        : code === 'EISDIR'
          ? 'it is a directory'
          : (error as Error).message;
    throw new UsageError(`cannot read deck '${path}': ${why}`);
  }
  return parseDeck(text);
}

function nodeNames(deck: ParsedDeck): Set<string> {
  return new Set(deck.circuit.elements.flatMap((e) => e.nodes.map((n) => n.toLowerCase())));
}

function runAc(args: CliArgs, deck: ParsedDeck): unknown {
  const sweep = deck.directives.ac;
  if (!sweep) throw new UsageError(`deck '${args.deck ?? ''}' has no .ac card to run`);
  if (!args.probe) throw new UsageError('ac needs --probe NODE');
  const nodes = nodeNames(deck);
  for (const node of [args.probe.toLowerCase(), args.ref]) {
    if (node !== undefined && !nodes.has(node))
      throw new UsageError(`probe node '${node}' is not in the deck`);
  }
  const temperature = args.temp ?? deck.directives.temperature;
  const result = runAcSweep(deck.circuit, {
    sweep,
    probe: args.probe.toLowerCase(),
    ...(args.ref === undefined ? {} : { reference: args.ref }),
    ...(temperature === undefined ? {} : { temperature }),
  });
  return { freq: result.freq, db: result.db, deg: result.deg };
}

/** The input both variation commands share: the deck's circuit and temperature, the probe and the tolerances. */
function variationInput(args: CliArgs, deck: ParsedDeck) {
  const command = args.command ?? '';
  if (!args.probe) throw new UsageError(`${command} needs --probe PATH`);
  if (args.tols.length === 0) throw new UsageError(`${command} needs at least one --tol NAME=P%`);
  const temperature = args.temp ?? deck.directives.temperature;
  return {
    circuit: deck.circuit,
    settings: temperature === undefined ? {} : { temperature },
    parameters: args.tols.map(parseToleranceArgument),
    probes: [args.probe],
  };
}

function runMc(args: CliArgs, deck: ParsedDeck): unknown {
  if (args.samples === undefined) throw new UsageError('mc needs --samples N');
  if (args.seed === undefined) throw new UsageError('mc needs --seed S');
  const input = variationInput(args, deck);
  const result = runMonteCarlo({ ...input, samples: args.samples, seed: args.seed });
  return mcReport(result, input.probes[0]!);
}

function runCornersCommand(args: CliArgs, deck: ParsedDeck): unknown {
  const input = variationInput(args, deck);
  return cornersReport(runCorners(input), input.probes[0]!);
}

const COMMANDS = ['op', 'ac', 'mc', 'corners'];

function run(argv: string[], io: CliIo): number {
  const args = parseArgs(argv);
  if (args.help) {
    io.stdout(`${usage}\n`);
    return 0;
  }
  if (args.command === undefined)
    throw new UsageError('no command given; expected op, ac, mc or corners');
  if (!COMMANDS.includes(args.command))
    throw new UsageError(`unknown command '${args.command}'; expected op, ac, mc or corners`);
  if (!args.deck) throw new UsageError(`${args.command} needs a DECK file`);
  const deck = readDeck(args.deck, io);
  if (!args.quiet)
    for (const w of deck.warnings) io.stderr(`biasproof: warning: line ${w.line}: ${w.message}\n`);
  let output: unknown;
  if (args.command === 'op') {
    const temperature = args.temp ?? deck.directives.temperature;
    output = opReport(
      solveOperatingPoint(deck.circuit, temperature === undefined ? {} : { temperature }),
    );
  } else if (args.command === 'ac') {
    output = runAc(args, deck);
  } else if (args.command === 'mc') {
    output = runMc(args, deck);
  } else {
    output = runCornersCommand(args, deck);
  }
  // JSON has no Infinity: JSON.stringify writes null for it, as the help text promises.
  io.stdout(`${JSON.stringify(output, null, 2)}\n`);
  return 0;
}

/** Runs the command with `argv` (without node and script); returns the exit status. */
export function runCli(argv: string[], io: CliIo): number {
  try {
    return run(argv, io);
  } catch (error) {
    if (error instanceof UsageError || isEngineError(error)) {
      const hint =
        error instanceof UsageError && !error.message.startsWith('cannot read')
          ? ' (see biasproof --help)'
          : '';
      io.stderr(`biasproof: ${error.message.replace(/\s*\n\s*/g, ' ')}${hint}\n`);
      return 2;
    }
    io.stderr(
      `biasproof: internal error: ${error instanceof Error ? error.message : String(error)}\n`,
    );
    return 1;
  }
}

/** Entry point for the bin wrapper: the process's arguments, files and streams. */
export function main(): void {
  process.exitCode = runCli(process.argv.slice(2), {
    readFile: (path) => readFileSync(path, 'utf8'),
    stdout: (text) => process.stdout.write(text),
    stderr: (text) => process.stderr.write(text),
  });
}
