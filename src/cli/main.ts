import { PartsmithError } from '../client/errors.js';
import { APP_VERSION } from '../version.js';
import { flagOf, parseArgs, UsageError, type ParsedFlag } from './flags.js';
import { Progress, Sink } from './output.js';
import { runListing } from './listing.js';
import { runSamples } from './samples.js';
import { startServer } from './serve.js';
import { localFetch, localSource, remoteSource, type Source } from './source.js';
import { endpointSpecs, isSwitchParam, paramHelp, type EndpointSpec } from './spec.js';

/** Flags of the CLI itself, never sent to the API. */
const CLI_FLAGS: Record<string, string> = {
  url: '--url URL     ask the service running at URL instead of computing in this process',
  out: '--out FILE    write to FILE instead of standard output',
  quiet: '--quiet       no progress bar',
};
const CLI_SWITCHES = new Set(['quiet']);

const COMMANDS: Record<string, { path: string; usage: string }> = {
  partitions: { path: '/v1/partitions', usage: 'partsmith partitions --n 100 --count 5 --seed demo [--distinct --max-part 10 ...] [--format text|json|ndjson] [--out FILE]' },
  compositions: { path: '/v1/compositions', usage: 'partsmith compositions --n 10 --count 5 --seed demo [--length 3 ...] [--format text|json|ndjson] [--out FILE]' },
  'set-partitions': { path: '/v1/set-partitions', usage: 'partsmith set-partitions --n 10 --count 5 --seed demo [--blocks 3 --min-block-size 2 ...] [--as blocks|rgs] [--format text|json|ndjson] [--out FILE]' },
  'count partitions': { path: '/v1/partitions/count', usage: 'partsmith count [partitions] --n 100 [--distinct ...]' },
  'count compositions': { path: '/v1/compositions/count', usage: 'partsmith count compositions --n 10 [--length 3 ...]' },
  'count set-partitions': { path: '/v1/set-partitions/count', usage: 'partsmith count set-partitions --n 10 [--blocks 3 ...]' },
  'list partitions': { path: '/v1/partitions/list', usage: 'partsmith list [partitions] --n 12 [--max-length 4 ...] [--start RANK] [--count K] [--format text|json|ndjson] [--out FILE]' },
  'list compositions': { path: '/v1/compositions/list', usage: 'partsmith list compositions --n 10 [--allowed 1,2,3 ...] [--start RANK] [--count K] [--format text|json|ndjson] [--out FILE]' },
  'list set-partitions': { path: '/v1/set-partitions/list', usage: 'partsmith list set-partitions --n 6 [--blocks 3 ...] [--as blocks|rgs] [--start RANK] [--count K] [--format text|json|ndjson] [--out FILE]' },
  'rank partitions': { path: '/v1/partitions/rank', usage: 'partsmith rank [partitions] --parts 5,4,1 [--n 10] [--max-part 5 ...]' },
  'rank compositions': { path: '/v1/compositions/rank', usage: 'partsmith rank compositions --parts 1,3,1 [--n 5] [--length 3 ...]' },
  'rank set-partitions': { path: '/v1/set-partitions/rank', usage: 'partsmith rank set-partitions --rgs 0,1,0,2 [--n 4] [--max-blocks 3 ...]' },
  'unrank partitions': { path: '/v1/partitions/unrank', usage: 'partsmith unrank [partitions] --n 12 --rank 17 [--distinct ...]' },
  'unrank compositions': { path: '/v1/compositions/unrank', usage: 'partsmith unrank compositions --n 10 --rank 17 [--length 3 ...]' },
  'unrank set-partitions': { path: '/v1/set-partitions/unrank', usage: 'partsmith unrank set-partitions --n 10 --rank 17 [--blocks 3 ...] [--as blocks|rgs]' },
};

/** Commands followed by the kind of family (partitions when it is left out). */
const FAMILY_COMMANDS = ['count', 'list', 'rank', 'unrank'];

/** The kinds those commands take. */
const FAMILY_KINDS = ['partitions', 'compositions', 'set-partitions'];

const OVERVIEW = `partsmith ${APP_VERSION}: exactly uniform random integer partitions and compositions of n, and set partitions of n items, reproducible from a seed.

Commands:
  partsmith partitions ...      uniformly random partitions of n
  partsmith compositions ...    uniformly random compositions of n
  partsmith set-partitions ...  uniformly random set partitions of the items 1..n
  partsmith count [partitions|compositions|set-partitions] ...   the exact number of members of a family
  partsmith list [partitions|compositions|set-partitions] ...    every member, in order, each with its rank
  partsmith rank [partitions|compositions] --parts 5,4,1 ...   the rank of a member
  partsmith rank set-partitions --rgs 0,1,0,2 ...   the rank of a set partition (its restricted growth string)
  partsmith unrank [partitions|compositions|set-partitions] --n 12 --rank 17 ...   the member at a rank
  partsmith serve [--port 8787] [--host 127.0.0.1]   run the HTTP service

Every command takes --help. Flags are the API's query parameters in kebab case (maxPart is
--max-part), and --format json prints exactly the document the API returns for the same request.

Examples:
  partsmith partitions --n 100 --count 5 --seed demo --format text
  partsmith partitions --n 1000 --count 1000000 --seed load --format ndjson --out samples.ndjson
  partsmith count --n 100
  partsmith list --n 12 --max-length 4 --format text
  partsmith partitions --n 100 --count 5 --seed demo --url http://127.0.0.1:8787

Orders: partitions list their parts largest first, in reverse lexicographic order (n first,
1 + ... + 1 last); compositions in lexicographic order of their parts (1 + ... + 1 first); set
partitions in lexicographic order of their restricted growth strings (one block first).
`;

/** Where the CLI writes; the process's own streams unless a caller (a test) passes others. */
export interface CliIo {
  readonly stdout: NodeJS.WritableStream & { isTTY?: boolean };
  readonly stderr: NodeJS.WritableStream & { isTTY?: boolean };
}

/** Runs the CLI; returns the exit code (0 ok, 1 the request failed, 2 the command line is wrong). */
export async function runCli(argv: readonly string[], io: CliIo = { stdout: process.stdout, stderr: process.stderr }): Promise<number> {
  const words = argv.filter((a) => !a.startsWith('-'));
  let label = 'partsmith';
  let sink: Sink | undefined;
  try {
    if (argv.includes('--version')) {
      io.stdout.write(`${APP_VERSION}\n`);
      return 0;
    }
    const command = words[0];
    if (command === undefined) {
      io.stdout.write(OVERVIEW);
      return argv.includes('--help') || argv.includes('-h') ? 0 : 2;
    }
    if (command === 'serve') {
      label = 'partsmith serve';
      const args = parseArgs(argv.slice(argv.indexOf('serve') + 1), () => false);
      if (args.help) {
        io.stdout.write('Usage: partsmith serve [--port 8787] [--host 127.0.0.1]\n\nRuns the HTTP service (PORT and HOST are read when the flags are absent). --port 0 picks a free port.\n');
        return 0;
      }
      const unknown = args.flags.find((f) => f.name !== 'port' && f.name !== 'host');
      if (unknown || args.positionals.length > 0) throw new UsageError(`unknown ${unknown ? `flag ${flagOf(unknown.name)}` : `argument ${args.positionals[0]}`}; see partsmith serve --help`);
      await startServer(args.flags.find((f) => f.name === 'port')?.value, args.flags.find((f) => f.name === 'host')?.value);
      return 0;
    }

    let key = command;
    let rest = argv.slice(argv.indexOf(command) + 1);
    if (FAMILY_COMMANDS.includes(command)) {
      const kind = FAMILY_KINDS.includes(rest[0]) ? rest[0] : 'partitions';
      label = `partsmith ${rest[0] === kind ? `${command} ${kind}` : command}`;
      if (rest[0] === kind) rest = rest.slice(1);
      key = `${command} ${kind}`;
    } else {
      label = `partsmith ${key}`;
    }
    const entry = COMMANDS[key];
    if (!entry) throw new UsageError(`unknown command ${JSON.stringify(command)}; commands: partitions, compositions, set-partitions, count, list, rank, unrank, serve (see partsmith --help)`);

    const specs = endpointSpecs((await (await localFetch()('/openapi.json')).json()) as Record<string, unknown>);
    const spec = specs.get(entry.path);
    if (!spec) throw new UsageError(`${key} is not served by this version (${APP_VERSION}) yet`);

    const args = parseArgs(rest, (name) => CLI_SWITCHES.has(name) || isSwitchParam(spec, name));
    if (args.help) {
      io.stdout.write(commandHelp(entry.usage, spec));
      return 0;
    }
    if (args.positionals.length > 0) throw new UsageError(`unexpected argument ${JSON.stringify(args.positionals[0])}; values follow their flag, e.g. --n 100`);
    const cli = new Map<string, string>();
    const params: ParsedFlag[] = [];
    for (const flag of args.flags) {
      if (flag.name in CLI_FLAGS) {
        if (cli.has(flag.name)) throw new UsageError(`${flagOf(flag.name)} is given more than once`);
        cli.set(flag.name, flag.value);
      } else {
        params.push(flag);
      }
    }

    const source: Source = cli.has('url') ? await remoteSource(cli.get('url')!) : localSource();
    sink = new Sink(cli.get('out'), io.stdout);
    const quiet = cli.get('quiet') === 'true';
    try {
      const single = key.startsWith('count ') || key.startsWith('rank ') || key.startsWith('unrank ');
      const makeProgress = (unit: string) => (total: number) => new Progress(total, io.stderr, !quiet && io.stderr.isTTY === true, progressDelayMs(), unit);
      if (single) {
        const query = new URLSearchParams(params.map((p) => [p.name, p.value])).toString();
        const answer = await source.get(spec.path + (query ? `?${query}` : ''));
        const decoder = new TextDecoder();
        for await (const chunk of answer.body) await sink.write(decoder.decode(chunk, { stream: true }));
      } else if (key.startsWith('list ')) {
        await runListing({ spec, params, source, sink, makeProgress: makeProgress('members') });
      } else {
        await runSamples({ spec, params, source, sink, makeProgress: makeProgress('samples') });
      }
      // JSON documents end without a newline (as the API sends them); add one for a person reading a terminal.
      if (sink.isTerminal && (single || (params.find((p) => p.name === 'format')?.value ?? 'json') === 'json')) await sink.write('\n');
      await sink.finish();
    } finally {
      await source.close();
    }
    return 0;
  } catch (error) {
    sink?.abandon();
    io.stderr.write(`${label}: ${describe(error)}\n`);
    return error instanceof UsageError || (error instanceof PartsmithError && error.status === 400) ? 2 : 1;
  }
}

function commandHelp(usage: string, spec: EndpointSpec): string {
  return [
    `Usage: ${usage}`,
    '',
    `${spec.summary}. Same parameters as GET ${spec.path}; see /openapi.json.`,
    '',
    'Parameters:',
    ...paramHelp(spec),
    '',
    'Options:',
    ...Object.values(CLI_FLAGS).map((line) => `  ${line}`),
    '  --help        this text',
    '',
  ].join('\n');
}

/** One line for stderr: the problem with its parameters named as flags. */
function describe(error: unknown): string {
  if (error instanceof PartsmithError) {
    if (error.errors.length > 0) {
      return error.errors
        .map((e) => `${/^[A-Za-z][A-Za-z0-9]*$/.test(e.param) ? flagOf(e.param) : e.param} ${e.message.replace('is not a parameter of this endpoint', 'is not a flag of this command (see --help)')}`)
        .join('; ');
    }
    return error.detail;
  }
  if (error instanceof UsageError || error instanceof RangeError) return error.message;
  const code = (error as { code?: unknown })?.code;
  const message = error instanceof Error ? error.message : String(error);
  if (typeof code === 'string' && (code.startsWith('E') || code.startsWith('UND_ERR'))) return `could not reach the service: ${message} (${code})`;
  return message.split('\n')[0];
}

/** The progress bar's quiet period: PARTSMITH_PROGRESS_AFTER_MS (whole milliseconds), default 1000. */
function progressDelayMs(): number {
  const raw = process.env.PARTSMITH_PROGRESS_AFTER_MS;
  return raw !== undefined && /^[0-9]{1,7}$/.test(raw) ? Number(raw) : 1000;
}
