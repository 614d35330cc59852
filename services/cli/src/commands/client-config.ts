/** `betasweep config` — store the server URL and token for the client commands. */
import type { Command } from 'commander';
import { clientConfigPath, readClientConfigFile, resolveClientConfig, writeClientConfigFile } from '../client/index.js';
import type { RegisterCommand } from './index.js';

export const registerClientConfig: RegisterCommand = (program: Command) => {
  program.command('config')
    .description('save the server URL and token the client commands use (file mode 0600)')
    .option('--server <url>', 'API address to save')
    .option('--token <token>', 'token to save')
    .option('--show', 'show the effective settings and where they come from')
    .action((flags: { server?: string; token?: string; show?: boolean }) => {
      const path = clientConfigPath();
      if (flags.server || flags.token) {
        if (flags.server) resolveClientConfig({ server: flags.server });
        writeClientConfigFile({ server: flags.server, token: flags.token }, path);
        process.stderr.write(`saved to ${path}\n`);
      }
      if (flags.show || (!flags.server && !flags.token)) {
        readClientConfigFile(path);
        const c = resolveClientConfig({});
        const masked = c.token ? `${c.token.slice(0, 8)}…` : '(none)';
        process.stdout.write(`config file  ${path}\nserver       ${c.server} (from ${c.serverFrom})\ntoken        ${masked} (from ${c.tokenFrom})\n`);
      }
    });
};
