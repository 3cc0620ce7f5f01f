// `packsmith serve [folder] [--port N] [--host H] [--out DIR]`: the live drafts of every job in the
// folder, a form per job to record a test session, and the archive site, until interrupted.
import { parseArgs } from 'node:util';
import { existsSync, statSync } from 'node:fs';

export const SERVE_USAGE = 'packsmith serve [folder] [--port N] [--host H] [--out DIR]';
export const DEFAULT_PORT = 4417;

export async function serveCommand(args: string[]): Promise<0 | 2> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: { port: { type: 'string', default: String(DEFAULT_PORT) }, host: { type: 'string', default: '127.0.0.1' }, out: { type: 'string', default: 'out' } },
  });
  if (positionals.length > 1) {
    process.stderr.write(`packsmith serve takes one folder (of job folders, or a job folder)\nusage: ${SERVE_USAGE}\n`);
    return 2;
  }
  const folder = positionals[0] ?? 'projects';
  if (!existsSync(folder) || !statSync(folder).isDirectory()) {
    process.stderr.write(`packsmith serve: no folder "${folder}"; expected a folder of job folders (default projects/) or a job folder\n`);
    return 2;
  }
  const port = Number(values.port);
  if (!/^\d+$/.test(values.port!) || port > 65535) {
    process.stderr.write(`packsmith serve: --port "${values.port}": expected a port number from 0 (any free port) to 65535\n`);
    return 2;
  }
  const { serve } = await import('../serve/server.js');
  let serving;
  try {
    serving = await serve({ folder, out: values.out!, host: values.host!, port });
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    const why = err.code === 'EADDRINUSE' ? `port ${port} is in use; try another with --port (0: any free port)` : err.message;
    process.stderr.write(`packsmith serve: cannot listen on ${values.host}:${port}: ${why}\n`);
    return 2;
  }
  const jobs = serving.jobs.list();
  process.stdout.write(`packsmith serve: ${jobs.length} job${jobs.length === 1 ? '' : 's'} from ${folder}, at ${serving.url}\n`);
  if (serving.token) {
    process.stdout.write('packsmith serve: this address carries a token: only someone given it can use the server. Press Ctrl+C to stop.\n');
  }
  await new Promise<void>((resolve) => {
    const stop = () => resolve();
    process.once('SIGINT', stop);
    process.once('SIGTERM', stop);
  });
  await serving.close();
  return 0;
}
