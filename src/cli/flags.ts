/**
 * Command-line flags <-> query parameters. A flag is the parameter's name in kebab case
 * (--max-part <-> maxPart), so there is nothing to keep in sync by hand: the parameters,
 * their types and their help text come from the API's own OpenAPI document, which is generated
 * from the endpoints' zod schemas.
 */

export class UsageError extends Error {}

export function flagOf(param: string): string {
  return `--${param.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`)}`;
}

export function paramOf(flag: string): string {
  return flag.replace(/^--/, '').replace(/-([a-z0-9])/g, (_m, c: string) => c.toUpperCase());
}

export interface ParsedFlag {
  /** Parameter name (camel case). */
  readonly name: string;
  readonly value: string;
}

export interface ParsedArgs {
  readonly positionals: string[];
  readonly flags: ParsedFlag[];
  readonly help: boolean;
}

/**
 * Reads argv: `--name value`, `--name=value`, and bare `--name` for switches (a following
 * `true`/`false` is taken as its value). Values are left as strings: the API's schema checks them.
 */
export function parseArgs(argv: readonly string[], isSwitch: (name: string) => boolean): ParsedArgs {
  const positionals: string[] = [];
  const flags: ParsedFlag[] = [];
  let help = false;
  for (let i = 0; i < argv.length; i++) {
    const token = argv[i];
    if (token === '-h' || token === '--help') {
      help = true;
      continue;
    }
    if (!token.startsWith('--') || token === '--') {
      if (token.startsWith('-') && token.length > 1 && !/^-\d/.test(token)) throw new UsageError(`unknown option ${token} (flags are written --name value)`);
      positionals.push(token);
      continue;
    }
    const eq = token.indexOf('=');
    const name = paramOf(eq >= 0 ? token.slice(0, eq) : token);
    if (!/^[A-Za-z][A-Za-z0-9]*$/.test(name)) throw new UsageError(`malformed flag ${token}`);
    if (eq >= 0) {
      flags.push({ name, value: token.slice(eq + 1) });
    } else if (isSwitch(name)) {
      const next = argv[i + 1];
      if (next === 'true' || next === 'false') {
        flags.push({ name, value: next });
        i++;
      } else {
        flags.push({ name, value: 'true' });
      }
    } else {
      const next = argv[i + 1];
      if (next === undefined || (next.startsWith('--') && next.length > 2)) throw new UsageError(`${token} needs a value`);
      flags.push({ name, value: next });
      i++;
    }
  }
  return { positionals, flags, help };
}
