/**
 * The `phasewise` command line. Exit codes: 0 done, 1 internal fault, 2 bad input
 * (with a message naming the problem), 3 results written but a physical check failed
 * (unless --accept-failed-checks). The bin is bin.ts. Never evaluates input as
 * code; writes only inside the chosen output folder.
 * @internal
 * @module
 */
import { Command, CommanderError, InvalidArgumentError, Option } from 'commander';
import { UsageError, exitCodeFor } from './errors.js';
import { TAPER_KINDS, formatTaper, runTaper } from './commands/taper.js';
import { formatSpacing, runSpacing } from './commands/spacing.js';
import { formatOnOff, formatReceiverNoise, formatYFactor, noiseSourceSetting, runOnOff, runReceiverNoise, runYFactor, throwIfRejected } from './commands/measure.js';
import type { FluxCorrections } from '../measure/index.js';
import { failedChecksText, formatRun, parseShard, runEvaluate, runMerge, type ReportRun } from './commands/evaluate.js';
import { FailedChecksError } from './errors.js';
import { VERSION } from '../version.js';
import { DEMO_FOLDER, runDemo } from './commands/demo.js';

function numberArg(name: string, opts: { integer?: boolean; min?: number; max?: number } = {}) {
  return (value: string): number => {
    const v = Number(value);
    if (value.trim() === '' || !Number.isFinite(v) || (opts.integer && !Number.isInteger(v)) || (opts.min !== undefined && v < opts.min) || (opts.max !== undefined && v > opts.max)) {
      const range = [opts.integer ? 'an integer' : 'a number', opts.min !== undefined ? `≥ ${opts.min}` : '', opts.max !== undefined ? `≤ ${opts.max}` : ''].filter(Boolean).join(' ');
      throw new InvalidArgumentError(`${name} must be ${range}, received "${value}".`);
    }
    return v;
  };
}

/** Exit 3 (FailedChecksError) when the run's results failed a check, unless accepted (then a warning). */
function throwIfChecksFailed(run: ReportRun, accept: boolean, err: (s: string) => void): void {
  const text = failedChecksText(run);
  if (text === undefined) return;
  if (accept) {
    err(`phasewise: warning: ${text} (accepted with --accept-failed-checks; the report is marked)\n`);
    return;
  }
  throw new FailedChecksError(`${text}; the report is written and marked. Pass --accept-failed-checks to exit 0 anyway.`);
}

function parseShardArg(value: string): { index: number; count: number } {
  try {
    return parseShard(value);
  } catch (e) {
    throw new InvalidArgumentError((e as Error).message.replace(/^option "--shard": /, ''));
  }
}

/** Builds the program; `io` receives standard output text. @internal */
export function buildProgram(io: { out: (s: string) => void; err: (s: string) => void }): Command {
  const program = new Command('phasewise')
    .description('Receiving phased-array calculators and design-file evaluation (phasewise).')
    .version(VERSION, '-V, --version', 'print the version')
    .exitOverride()
    // One error style for every message: "phasewise: error: …" (commander's own errors included).
    .configureOutput({ writeOut: io.out, writeErr: io.err, outputError: (str, write) => write(`phasewise: ${str}`) })
    .showHelpAfterError(false)
    .addHelpText('after', [
      '',
      'Examples:',
      '  phasewise demo                                   # bundled S-band array, report in ./phasewise-demo-report',
      '  phasewise evaluate examples/designs/l-band-feed.json --out feed-report',
      '  phasewise taper --kind taylor --elements 24 --sidelobe-db 35',
      '  phasewise <command> --help                       # options and an example for each command',
    ].join('\n'));

  program.command('taper')
    .description('Weights and pattern figures of a line-array taper at broadside.')
    .addOption(new Option('--kind <kind>', 'taper family').choices([...TAPER_KINDS]).makeOptionMandatory())
    .requiredOption('--elements <n>', 'number of elements', numberArg('--elements', { integer: true, min: 1, max: 100000 }))
    .option('--sidelobe-db <dB>', 'design sidelobe level, positive dB below the peak (dolph-chebyshev, taylor)', numberArg('--sidelobe-db', { min: 0 }))
    .option('--nbar <n>', 'Taylor n̄', numberArg('--nbar', { integer: true, min: 1 }), 5)
    .option('--pedestal <p>', 'pedestal of the cosine tapers (0–1)', numberArg('--pedestal', { min: 0, max: 1 }))
    .option('--spacing-wavelengths <d>', 'element spacing for the pattern figures [λ]', numberArg('--spacing-wavelengths', { min: 1e-6 }), 0.5)
    .option('--json', 'print JSON instead of tables')
    .addHelpText('after', '\nExample:\n  phasewise taper --kind dolph-chebyshev --elements 16 --sidelobe-db 30')
    .action((o) => {
      const r = runTaper({ kind: o.kind, elements: o.elements, sidelobeDb: o.sidelobeDb, nbar: o.nbar, pedestal: o.pedestal, spacingWavelengths: o.spacingWavelengths });
      io.out((o.json ? JSON.stringify(r, null, 2) : formatTaper(r)) + '\n');
    });

  program.command('spacing')
    .description('Largest element spacing free of grating lobes over a scan cone (square and triangular lattices).')
    .requiredOption('--scan-deg <deg>', 'scan-cone half-angle from broadside [deg]', numberArg('--scan-deg', { min: 0, max: 90 }))
    .requiredOption('--frequency-hz <f>', 'highest operating frequency [Hz]', numberArg('--frequency-hz', { min: 1 }))
    .option('--json', 'print JSON instead of tables')
    .addHelpText('after', '\nExample:\n  phasewise spacing --scan-deg 40 --frequency-hz 2.25e9')
    .action((o) => {
      const r = runSpacing(o.scanDeg, o.frequencyHz);
      io.out((o.json ? JSON.stringify(r, null, 2) : formatSpacing(r)) + '\n');
    });

  program.command('yfactor')
    .description('Receiver noise temperature per channel from a hot/cold CSV table (columns channel, hot, cold).')
    .argument('<table.csv>', 'measurement table')
    .option('--hot-k <K>', 'hot-load noise temperature [K] (or give --enr-db)', numberArg('--hot-k', { min: 0 }))
    .option('--enr-db <dB>', 'calibrated noise source instead of a hot load: on temperature T0·(1 + ENR)', numberArg('--enr-db'))
    .option('--t0-k <K>', 'ENR reference temperature T0 [K]', numberArg('--t0-k', { min: 1e-9 }), 290)
    .requiredOption('--cold-k <K>', 'cold-load (or noise source off) temperature [K]', numberArg('--cold-k', { min: 0 }))
    .option('--db', 'the power columns are in dB')
    .option('--power-sigma <fraction>', 'one-sigma relative uncertainty of every power reading (0.01 = 1 %)', numberArg('--power-sigma', { min: 0 }))
    .option('--hot-sigma-k <K>', 'one-sigma uncertainty of the hot-load temperature [K]', numberArg('--hot-sigma-k', { min: 0 }))
    .option('--enr-sigma-db <dB>', 'one-sigma uncertainty of the ENR [dB] (noise-source form)', numberArg('--enr-sigma-db', { min: 0 }))
    .option('--cold-sigma-k <K>', 'one-sigma uncertainty of the cold-load temperature [K]', numberArg('--cold-sigma-k', { min: 0 }))
    .option('--json', 'print JSON instead of tables')
    .addHelpText('after', [
      '',
      'A row that cannot be reduced (a non-number, Y ≤ 1) is named with its line; the other channels are',
      'still printed, and the command exits 2.',
      '',
      'Examples:',
      '  phasewise yfactor bench.csv --hot-k 295 --cold-k 77',
      '  phasewise yfactor bench.csv --hot-k 295 --cold-k 77 --power-sigma 0.005 --hot-sigma-k 0.5 --cold-sigma-k 1',
      '  phasewise yfactor diode.csv --enr-db 15.2 --enr-sigma-db 0.1 --cold-k 296',
    ].join('\n'))
    .action((file: string, o) => {
      if ((o.hotK === undefined) === (o.enrDb === undefined)) throw new UsageError('give exactly one of --hot-k (hot load) and --enr-db (noise source).');
      if (o.enrSigmaDb !== undefined && o.enrDb === undefined) throw new UsageError('--enr-sigma-db needs --enr-db (with a hot load, give --hot-sigma-k).');
      if (o.hotSigmaK !== undefined && o.enrDb !== undefined) throw new UsageError('--hot-sigma-k is for a hot load; with --enr-db give --enr-sigma-db.');
      const source = o.enrDb === undefined ? undefined : noiseSourceSetting(o.enrDb, o.t0K, o.enrSigmaDb ?? 0);
      const hotK = source ? source.onTemperatureK : o.hotK;
      const r = runYFactor({
        file, hotTemperatureK: hotK, coldTemperatureK: o.coldK, db: Boolean(o.db),
        powerRelativeSigma: o.powerSigma, hotTemperatureSigmaK: source ? source.onTemperatureSigmaK : o.hotSigmaK, coldTemperatureSigmaK: o.coldSigmaK,
      });
      if (r.results.length > 0 || r.rejected.length === 0) {
        io.out((o.json ? JSON.stringify(source ? r.results.map((x) => ({ ...x, ...source })) : r.results, null, 2) : formatYFactor(r.results, hotK, o.coldK, source)) + '\n');
      }
      throwIfRejected(r, file, 'channel');
    });

  program.command('onoff')
    .description('Sensitivity A_e/T_sys and SEFD per beam from on-source and off-source powers on a calibrator (CSV columns beam, on, off).')
    .argument('<table.csv>', 'measurement table (linear powers)')
    .requiredOption('--flux-jy <Jy>', 'calibrator flux density, total over both polarisations [Jy]', numberArg('--flux-jy', { min: 1e-12 }))
    .option('--zenith-opacity-np <tau>', 'atmospheric zenith opacity τ [Np] (with --elevation-deg): S × exp(−τ/sin el)', numberArg('--zenith-opacity-np', { min: 0 }))
    .option('--elevation-deg <deg>', 'calibrator elevation [deg]', numberArg('--elevation-deg', { min: 0.06, max: 90 }))
    .option('--source-size-factor <K>', 'source-size correction K ≥ 1 for a partly resolved calibrator: S / K', numberArg('--source-size-factor', { min: 1 }))
    .option('--power-sigma <fraction>', 'one-sigma relative uncertainty of every power reading', numberArg('--power-sigma', { min: 0 }))
    .option('--flux-sigma <fraction>', 'one-sigma relative uncertainty of the calibrator flux density', numberArg('--flux-sigma', { min: 0 }))
    .option('--json', 'print JSON instead of tables')
    .addHelpText('after', '\nExample:\n  phasewise onoff drift-scan.csv --flux-jy 1500 --zenith-opacity-np 0.01 --elevation-deg 52 --power-sigma 0.002 --flux-sigma 0.05')
    .action((file: string, o) => {
      if ((o.zenithOpacityNp === undefined) !== (o.elevationDeg === undefined)) throw new UsageError('give --zenith-opacity-np and --elevation-deg together (the atmospheric correction needs both).');
      const corrections: FluxCorrections = {
        ...(o.zenithOpacityNp !== undefined ? { atmosphere: { zenithOpacityNp: o.zenithOpacityNp, elevationRad: (o.elevationDeg * Math.PI) / 180 } } : {}),
        ...(o.sourceSizeFactor !== undefined ? { sourceSizeFactor: o.sourceSizeFactor } : {}),
      };
      const r = runOnOff({ file, fluxJy: o.fluxJy, corrections, powerRelativeSigma: o.powerSigma, fluxRelativeSigma: o.fluxSigma });
      if (r.results.length > 0 || r.rejected.length === 0) io.out((o.json ? JSON.stringify(r.results, null, 2) : formatOnOff(r.results, o.fluxJy)) + '\n');
      throwIfRejected(r, file, 'beam');
    });

  program.command('receiver-noise')
    .description('Matrix Y-factor: receiver noise temperature of every channel (and of given beams) from hot and cold correlation matrices.')
    .requiredOption('--hot <hot.json>', 'correlation matrix with the hot environment ({"rows", "cols", "re", "im"}, row-major)')
    .requiredOption('--cold <cold.json>', 'correlation matrix with the cold environment, same form')
    .requiredOption('--hot-k <K>', 'brightness temperature of the hot environment [K]', numberArg('--hot-k', { min: 0 }))
    .requiredOption('--cold-k <K>', 'brightness temperature of the cold environment [K]', numberArg('--cold-k', { min: 0 }))
    .option('--weights <w.json>', 'beam weights, one column per beam (same matrix form)')
    .option('--json', 'print JSON instead of tables')
    .addHelpText('after', '\nBoth environments must fill the whole pattern with the same angular shape (absorber around the array, uniform cold sky).\n\nExample:\n  phasewise receiver-noise --hot absorber.json --cold zenith.json --hot-k 293 --cold-k 12 --weights beams.json')
    .action((o) => {
      const r = runReceiverNoise(o.hot, o.cold, o.hotK, o.coldK, o.weights);
      io.out((o.json ? JSON.stringify({ channels: r.perChannel, beams: r.beams }, null, 2) : formatReceiverNoise(r, o.hotK, o.coldK)) + '\n');
    });

  program.command('evaluate')
    .description('Evaluate a receiving-array design file across its band and write a report folder (report.html, figures.json, SVG figures).')
    .argument('<design.json>', 'design file (JSON; paths inside it are relative to its folder)')
    .requiredOption('--out <folder>', 'report folder (created if needed; nothing is written outside it)')
    .option('--workers <n>', 'worker threads for the frequency blocks (default: every core)', numberArg('--workers', { integer: true, min: 1, max: 1024 }))
    .option('--shard <i/n>', 'evaluate only block i of n of the band and write part-i-of-n.json (combine with "phasewise merge")', parseShardArg)
    .option('--no-progress', 'no progress bar (it is shown only when stderr is a terminal)')
    .option('--dry-run', 'print the estimated time and memory only; evaluate and write nothing')
    .option('--accept-failed-checks', 'exit 0 even when results fail a physical check (the report is marked either way)')
    .addHelpText('after', [
      '',
      'Exit codes: 0 done, 1 internal fault, 2 bad input, 3 a physical check failed (report written, marked).',
      '',
      'Example:',
      '  phasewise evaluate feed-array.json --out feed-report',
      '  phasewise evaluate feed-array.json --out parts --shard 2/8     # one block of the band',
      '  phasewise merge parts/part-*-of-8.json --out feed-report',
      '',
      'A minimal design file:',
      '  {"frequencyHz": {"fromHz": 1.3e9, "toHz": 1.5e9, "count": 5}, "bandwidthHz": 1e6,',
      '   "layout": {"kind": "rectangular", "countX": 4, "countY": 4, "spacingXM": 0.107, "spacingYM": 0.107},',
      '   "elements": {"kind": "dipole", "lengthM": 0.1, "radiusM": 0.0005, "axis": [1, 0, 0], "groundPlaneHeightM": 0.054},',
      '   "amplifiers": {"minimumNoiseTemperatureK": 25, "noiseResistanceOhm": 4, "optimumSourceAdmittanceS": 0.02},',
      '   "environment": {"skyK": 10, "groundK": 290},',
      '   "beams": {"cone": {"maxThetaDeg": 30, "stepUV": 0.2}, "beamformer": "max-snr"}}',
    ].join('\n'))
    .action(async (file: string, o) => {
      const run = await runEvaluate(file, o.out, { progress: o.progress !== false, workers: o.workers, shard: o.shard, dryRun: o.dryRun === true, log: io.err });
      io.out(formatRun(run) + '\n');
      throwIfChecksFailed(run, o.acceptFailedChecks === true, io.err);
    });

  program.command('merge')
    .description('Merge the shard parts of one design (phasewise evaluate --shard i/n) into the report a single run writes.')
    .argument('<parts...>', 'part files part-<i>-of-<n>.json, all shards of one design')
    .requiredOption('--out <folder>', 'report folder')
    .option('--accept-failed-checks', 'exit 0 even when results fail a physical check (the report is marked either way)')
    .addHelpText('after', '\nExample:\n  phasewise merge parts/part-1-of-2.json parts/part-2-of-2.json --out report')
    .action(async (parts: string[], o) => {
      const run = await runMerge(parts, o.out);
      io.out(formatRun(run) + '\n');
      throwIfChecksFailed(run, o.acceptFailedChecks === true, io.err);
    });

  program.command('demo')
    .description('Evaluate a bundled design (61 dipoles over ground, S-band telemetry, ±40° scan) and write its report.')
    .option('--out <folder>', 'report folder', DEMO_FOLDER)
    .option('--no-progress', 'no progress bar')
    .addHelpText('after', '\nExample:\n  phasewise demo --out demo-report')
    .option('--workers <n>', 'worker threads (default: every core)', numberArg('--workers', { integer: true, min: 1, max: 1024 }))
    .action(async (o) => {
      const run = await runDemo(o.out, { progress: o.progress !== false, workers: o.workers });
      io.out(formatRun(run) + '\n');
      throwIfChecksFailed(run, false, io.err);
    });

  return program;
}

/** Runs the command line with `argv` (without node and script); returns the exit code. @internal */
export async function runCli(argv: readonly string[], io = { out: (s: string) => void process.stdout.write(s), err: (s: string) => void process.stderr.write(s) }): Promise<number> {
  const program = buildProgram(io);
  try {
    await program.parseAsync([...argv], { from: 'user' });
    return 0;
  } catch (e) {
    if (e instanceof CommanderError) {
      if (e.code === 'commander.helpDisplayed' || e.code === 'commander.version' || e.exitCode === 0) return 0;
      if (e.code === 'commander.help') return 0;
      return 2; // commander already printed its message
    }
    const code = exitCodeFor(e);
    const msg = e instanceof Error ? e.message : String(e);
    io.err(`phasewise: ${code === 3 ? 'failed checks' : code === 2 ? 'error' : 'internal error'}: ${msg}\n`);
    if (code === 1 && e instanceof Error && e.stack) io.err(e.stack + '\n');
    return code;
  }
}

export { UsageError };
