/**
 * `betasweep plot ID|RESULT.json --out FILE.svg|FILE.png` — the dashboard's figures without a
 * browser: one time-series figure per observable (one line per β on the temperature scale,
 * error bands, the series cross-check in its trust window) and the thermodynamics against β,
 * stacked in one SVG (or PNG). A sweep id is fetched from the server (client config: --server,
 * --token, environment, config file) with the server's cross-check when it offers one; a result
 * file is read locally and cross-checked locally (skip with --no-check, or pass --check FILE).
 */
import { existsSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import type { Command } from 'commander';
import { SweepResult } from '../../../../shared-types/src/index.js';
import { CHECK_UNAVAILABLE, buildFigures, plotDataFromResult, usableCheck, type CheckReportBody, type Figure } from '../../../plot/index.js';
import { figuresToSvg, svgToPngBytes } from '../../../plot/render-in-node.js';
import { ClientError, action, clientOptions, withClient, type ClientFlags } from '../client/index.js';
import type { RegisterCommand } from './index.js';
import { writeFileAtomic } from '../write-atomic.js';

interface PlotFlags extends ClientFlags {
  out: string;
  figure?: string[];
  width: string;
  check?: boolean | string;
}

const SWEEP_ID = /^sw_[a-z2-7]{16}$/;

/** The result and cross-check of a sweep on the server. */
async function fromServer(id: string, flags: PlotFlags): Promise<{ result: SweepResult; check: CheckReportBody | null; note: string }> {
  const client = withClient(flags);
  const result = await client.request<SweepResult>('GET', `/v1/sweeps/${encodeURIComponent(id)}/result`, undefined, { sweepId: id });
  if (flags.check === false) return { result, check: null, note: `${CHECK_UNAVAILABLE} (--no-check)` };
  if (typeof flags.check === 'string') return { result, ...(await checkFromFile(flags.check)) };
  // The server computes the check right after the sweep succeeds: 409 until it is stored.
  for (let attempt = 1; ; attempt++) {
    const res = await client.fetchRaw(`/v1/sweeps/${encodeURIComponent(id)}/check`);
    const text = await res.text();
    if (res.ok) return { result, ...parseCheck(text, 'the server') };
    if (res.status === 409 && attempt < CHECK_WAITS) {
      await new Promise((r) => setTimeout(r, CHECK_WAIT_MS));
      continue;
    }
    const why = res.status === 404 && /BSW_ERR_ROUTE_NOT_FOUND/.test(text) ? 'the server has no cross-check route'
      : res.status === 409 ? 'the server has not computed it yet' : `HTTP ${res.status}`;
    return { result, check: null, note: `${CHECK_UNAVAILABLE}: ${why}` };
  }
}

/** Tries of a cross-check the server has not stored yet, and the pause between them. */
const CHECK_WAITS = 10;
const CHECK_WAIT_MS = 1500;

function parseCheck(text: string, from: string): { check: CheckReportBody | null; note: string } {
  let raw: unknown;
  try { raw = JSON.parse(text); } catch { return { check: null, note: `${CHECK_UNAVAILABLE}: ${from} sent no JSON` }; }
  return usableCheck(raw, from);
}

async function checkFromFile(path: string): Promise<{ check: CheckReportBody | null; note: string }> {
  let text: string;
  try { text = await readFile(path, 'utf8'); } catch (err) { throw new ClientError(`cannot read the check report ${path}: ${(err as Error).message}`, 2); }
  const out = parseCheck(text, path);
  if (!out.check) throw new ClientError(`${path} is not a cross-check report (${out.note})`, 2);
  return out;
}

/** A local result file, validated, and its cross-check (computed here unless told otherwise). */
async function fromFile(path: string, flags: PlotFlags): Promise<{ result: SweepResult; check: CheckReportBody | null; note: string }> {
  let raw: unknown;
  try {
    raw = JSON.parse(await readFile(path, 'utf8'));
  } catch (err) {
    throw new ClientError(`cannot read ${path} as JSON: ${(err as Error).message}`, 2);
  }
  const parsed = SweepResult.safeParse(raw);
  if (!parsed.success) {
    const first = parsed.error.issues.slice(0, 3).map((i) => `${i.path.join('.') || 'document'}: ${i.message}`).join('; ');
    throw new ClientError(`${path} is not a betasweep result document (${first})`, 2);
  }
  const result = parsed.data;
  if (flags.check === false) return { result, check: null, note: `${CHECK_UNAVAILABLE} (--no-check)` };
  if (typeof flags.check === 'string') return { result, ...(await checkFromFile(flags.check)) };
  try {
    const { checkReport } = await import('../../../../workers/src/series/index.js');
    return { result, ...parseCheck(JSON.stringify(checkReport(result)), 'the local series check') };
  } catch (err) {
    return { result, check: null, note: `${CHECK_UNAVAILABLE}: ${(err as Error).message.split('\n')[0]}` };
  }
}

export const registerPlot: RegisterCommand = (program: Command) => {
  clientOptions(program.command('plot'))
    .description("draw a sweep's figures (time series per β, thermodynamics, series cross-check) as SVG or PNG")
    .argument('<source>', 'a sweep id (fetched from the server) or a result file (betasweep run --out, betasweep fetch)')
    .requiredOption('--out <file>', 'output file: .svg or .png')
    .option('--figure <id...>', 'only these figures (e.g. "series:X:avg", "thermo:energy"); default all')
    .option('--width <px>', 'width of the figures', '760')
    .option('--check <file>', 'a cross-check report to overlay (instead of the server\'s or a local one)')
    .option('--no-check', 'draw no cross-check')
    .action(action(async (source: string, flags: PlotFlags) => {
      const format = /\.png$/i.test(flags.out) ? 'png' : /\.svg$/i.test(flags.out) ? 'svg' : null;
      if (!format) throw new ClientError(`--out must end in .svg or .png, got '${flags.out}'`, 2);
      const width = Number(flags.width);
      if (!Number.isInteger(width) || width < 320 || width > 4000) throw new ClientError(`--width must be an integer from 320 to 4000, got '${flags.width}'`, 2);
      const local = existsSync(source);
      if (!local && !SWEEP_ID.test(source)) throw new ClientError(`'${source}' is neither a file nor a sweep id (sw_ and 16 characters a-z, 2-7)`, 2);
      const { result, check, note } = local ? await fromFile(source, flags) : await fromServer(source, flags);
      let figures: Figure[] = buildFigures(plotDataFromResult(result), { check, checkUnavailableNote: note || CHECK_UNAVAILABLE });
      if (flags.figure?.length) {
        const unknown = flags.figure.filter((f) => !figures.some((g) => g.id === f));
        if (unknown.length) throw new ClientError(`no figure ${unknown.map((u) => `'${u}'`).join(', ')}; this sweep has: ${figures.map((f) => f.id).join(', ')}`, 2);
        figures = figures.filter((f) => flags.figure!.includes(f.id));
      }
      const svg = figuresToSvg(figures, { width, heading: result.spec.label || (local ? source : `sweep ${source}`) });
      await writeFileAtomic(flags.out, format === 'png' ? svgToPngBytes(svg) : svg);
      process.stderr.write(`wrote ${flags.out}: ${figures.length} figure${figures.length === 1 ? '' : 's'} (${figures.map((f) => f.id).join(', ')})` +
        `${check ? '' : `; ${note || CHECK_UNAVAILABLE}`}\n`);
    }));
};
