/** A small, strict argument reader: known flags only, each with its allowed values. */
export interface FlagSpec {
  /** Allowed values; an empty list means the flag takes any value. */
  values?: readonly string[];
  /** A flag without a value. */
  boolean?: boolean;
}

export interface ParsedArgs {
  positional: string[];
  flags: Map<string, string | true>;
}

export class UsageError extends Error {}

/**
 * Reads `--name value`, `--name=value` and boolean `--name`. `--` ends the options: every argument
 * after it is a file, whatever it starts with. Before it, an argument starting with `-` (other
 * than `-` itself) is an option, and an unknown one is a usage error rather than a file name.
 */
export function parseArgs(argv: readonly string[], specs: Readonly<Record<string, FlagSpec>>): ParsedArgs {
  const positional: string[] = [];
  const flags = new Map<string, string | true>();
  const known = () => Object.keys(specs).map((k) => `--${k}`).join(', ') || 'none';
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    if (arg === '--') {
      positional.push(...argv.slice(i + 1));
      break;
    }
    if (!arg.startsWith('-') || arg === '-') {
      positional.push(arg);
      continue;
    }
    if (!arg.startsWith('--')) throw new UsageError(`unknown option ${arg}; known: ${known()} (a file whose name starts with '-' goes after --)`);
    const [name, inline] = splitFlag(arg.slice(2));
    const spec = specs[name];
    if (!spec) throw new UsageError(`unknown option --${name}; known: ${known()}`);
    if (spec.boolean) {
      flags.set(name, true);
      continue;
    }
    const value = inline ?? argv[++i];
    if (value === undefined) throw new UsageError(`--${name} needs a value`);
    if (spec.values && spec.values.length && !spec.values.includes(value)) {
      throw new UsageError(`--${name} takes ${spec.values.join('|')}, not '${value}'`);
    }
    flags.set(name, value);
  }
  return { positional, flags };
}

function splitFlag(text: string): [string, string | undefined] {
  const at = text.indexOf('=');
  return at < 0 ? [text, undefined] : [text.slice(0, at), text.slice(at + 1)];
}
