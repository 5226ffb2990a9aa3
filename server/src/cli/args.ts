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

export function parseArgs(argv: readonly string[], specs: Readonly<Record<string, FlagSpec>>): ParsedArgs {
  const positional: string[] = [];
  const flags = new Map<string, string | true>();
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    if (!arg.startsWith('--') || arg === '--') {
      if (arg !== '--') positional.push(arg);
      continue;
    }
    const [name, inline] = splitFlag(arg.slice(2));
    const spec = specs[name];
    if (!spec) throw new UsageError(`unknown option --${name}; known: ${Object.keys(specs).map((k) => `--${k}`).join(', ') || 'none'}`);
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
