/** `betasweep watch ID` — live progress and points from the event stream, until the sweep ends. */
import type { Command } from 'commander';
import cliProgress from 'cli-progress';
import pc from 'picocolors';
import { ClientError, action, clientOptions, readSweepEvents, withClient, type ClientFlags } from '../client/index.js';
import type { RegisterCommand } from './index.js';

interface WatchFlags extends ClientFlags {
  points?: boolean;
  json?: boolean;
  after?: string;
}

export const registerWatch: RegisterCommand = (program: Command) => {
  clientOptions(program.command('watch'))
    .description('follow a sweep live: progress, and with --points every point as it arrives')
    .argument('<id>', 'sweep id')
    .option('--points', 'print each point (β index, time index, values)')
    .option('--json', 'print every event as one JSON line (for scripts)')
    .option('--after <eventId>', 'resume after this event id')
    .action(action(async (id: string, flags: WatchFlags) => {
      const client = withClient(flags);
      const status = await client.request<{ pointsDone: number; pointsTotal: number; status: string; series: Array<{ label: string }>; betas: number[]; times: number[] }>(
        'GET', `/v1/sweeps/${encodeURIComponent(id)}`, undefined, { sweepId: id });
      const labels = status.series.map((s) => s.label);
      const interactive = !flags.json && !flags.points && process.stderr.isTTY;
      const bar = interactive ? new cliProgress.SingleBar({ format: `${id} {bar} {value}/{total} points | {state}`, hideCursor: true }, cliProgress.Presets.shades_classic) : null;
      bar?.start(status.pointsTotal, 0, { state: status.status });
      const seen = new Set<string>();
      let final = status.status;
      for await (const ev of readSweepEvents(client, id, { lastEventId: flags.after })) {
        if (flags.json) {
          process.stdout.write(JSON.stringify({ id: ev.id, type: ev.type, data: ev.data ? JSON.parse(ev.data) : null }) + '\n');
        }
        if (ev.type === 'point') {
          const p = JSON.parse(ev.data) as { betaIndex: number; timeIndex: number; values: number[] };
          seen.add(`${p.betaIndex}:${p.timeIndex}`);
          bar?.update(seen.size);
          if (flags.points && !flags.json) {
            const vals = p.values.map((v, k) => `${labels[k] ?? k}=${v.toPrecision(8)}`).join(' ');
            process.stdout.write(`β=${status.betas[p.betaIndex]} t=${status.times[p.timeIndex]} ${vals}\n`);
          }
        } else if (ev.type === 'status') {
          final = (JSON.parse(ev.data) as { status: string }).status;
          bar?.update({ state: final });
          if (!flags.json && !bar) process.stderr.write(`${id}: ${final}\n`);
        }
      }
      bar?.stop();
      if (!flags.json) {
        const color = final === 'succeeded' ? pc.green : final === 'failed' ? pc.red : pc.yellow;
        process.stderr.write(`${id}: ${color(final)}${final === 'succeeded' ? ` — fetch it with: betasweep fetch ${id} --format csv` : ''}\n`);
      }
      if (final === 'failed') throw new ClientError(`sweep ${id} failed (betasweep status ${id} shows why)`, 7);
    }));
};
