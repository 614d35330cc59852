/**
 * `betasweep run SPEC.json --out RESULT.json [--csv FILE] [--points FILE]`: the embedded
 * local mode (no server). Validates and plans first: an invalid or refused spec writes
 * nothing. Shows a progress bar with ETA on a terminal.
 */
import { createWriteStream, type WriteStream } from 'node:fs';
import type { Command } from 'commander';
import cliProgress from 'cli-progress';
import pc from 'picocolors';
import { resultToCsv, runSweep, selectEngine, SweepRefusedError } from '../../../../workers/src/sweep/index.js';
import { formatPlan, formatSeconds } from '../format-plan.js';
import { loadSpec } from '../load-spec.js';
import { writeFileAtomic } from '../write-atomic.js';

interface RunOptions {
  out: string;
  csv?: string;
  points?: string;
  quiet?: boolean;
}

export function registerRun(program: Command): void {
  program
    .command('run')
    .description('run a sweep locally (no server) and write the result document')
    .argument('<spec>', 'sweep spec JSON file')
    .requiredOption('-o, --out <file>', 'result document (JSON)')
    .option('--csv <file>', 'also write the series as CSV (beta,time,series,value,error)')
    .option('--points <file>', 'stream records as NDJSON while they are computed')
    .option('-q, --quiet', 'no progress output')
    .action(async (file: string, opts: RunOptions) => {
      const { spec, hash } = await loadSpec(file).catch((err) => { process.exitCode = 2; throw err; });
      const { plan } = selectEngine(spec);
      if (!plan.feasible) {
        process.exitCode = 3;
        throw new SweepRefusedError(plan);
      }
      const log = (s: string) => { if (!opts.quiet) process.stderr.write(s + '\n'); };
      log(pc.dim(formatPlan(plan, hash)));

      const tty = process.stderr.isTTY && !opts.quiet;
      const bar = tty
        ? new cliProgress.SingleBar({
          format: ' {bar} {percentage}% | {value}/{total} points | ETA {eta_formatted} | {engine}',
          hideCursor: true,
        }, cliProgress.Presets.shades_classic)
        : undefined;
      let stream: WriteStream | undefined;
      if (opts.points) stream = createWriteStream(opts.points);
      const emit = (kind: string, data: unknown) => stream?.write(JSON.stringify({ kind, data }) + '\n');

      const controller = new AbortController();
      const onSigint = () => controller.abort();
      process.once('SIGINT', onSigint);
      let lastLog = 0;
      try {
        const result = await runSweep(spec, {
          signal: controller.signal,
          sink: {
            begin: (h) => { emit('header', h); bar?.start(h.betas.length * h.times.length, 0, { engine: h.engine.name }); },
            thermo: (r) => emit('thermo', r),
            point: (p) => emit('point', p),
            diagnostics: (d) => emit('diagnostics', d),
          },
          onProgress: (done, total) => {
            bar?.update(done);
            if (!tty && !opts.quiet && (Date.now() - lastLog > 5000 || done === total)) {
              lastLog = Date.now();
              log(`${done}/${total} points`);
            }
          },
        });
        bar?.stop();
        await writeFileAtomic(opts.out, JSON.stringify(result));
        if (opts.csv) await writeFileAtomic(opts.csv, resultToCsv(result));
        const worstDrift = Math.max(...result.diagnostics.map((d) => d.h1Drift));
        log(pc.green(`done in ${formatSeconds(result.timing.seconds)}: ${result.series.length} series × ` +
          `${result.betas.length} β × ${result.times.length} times → ${opts.out}`));
        log(pc.dim(`max ⟨H1⟩ drift ${worstDrift.toExponential(2)}`));
      } finally {
        bar?.stop();
        process.off('SIGINT', onSigint);
        await new Promise<void>((r) => (stream ? stream.end(() => r()) : r()));
      }
    });
}
