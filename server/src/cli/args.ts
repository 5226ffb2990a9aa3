/**
 * The command line's options, parsed by Node's own parser (`util.parseArgs`, strict) behind a
 * table of the flags each command knows and the values each allows. `--` ends the options: every
 * argument after it is a file, whatever it starts with; `-` alone is standard input. Before `--`, an
 * argument starting with `-` is an option, and an unknown one is a usage error that says where files
 * starting with `-` go, rather than a file name.
 */
import { parseArgs as parseWithNode } from 'node:util';

export interface FlagSpec {
  /** Allowed values; an empty list means the flag takes any value. */
  values?: readonly string[];
  /** A flag without a value. */
  boolean?: boolean;
  /** May be given more than once (`--parts a.json --parts b.json`); its values are in `lists`. */
  repeatable?: boolean;
  /** A one-letter alias (`-h`). */
  short?: string;
}

export interface ParsedArgs {
  positional: string[];
  flags: Map<string, string | true>;
  /** The values of repeatable flags, in order. */
  lists: Map<string, string[]>;
}

export class UsageError extends Error {}

export function parseArgs(argv: readonly string[], specs: Readonly<Record<string, FlagSpec>>): ParsedArgs {
  const known = () => Object.keys(specs).map((k) => `--${k}`).join(', ') || 'none';
  const end = argv.indexOf('--');
  for (const arg of end < 0 ? argv : argv.slice(0, end)) {
    if (!arg.startsWith('-') || arg === '-') continue;
    if (arg.startsWith('--')) {
      const name = arg.slice(2).split('=')[0]!;
      if (!specs[name]) throw new UsageError(`unknown option --${name}; known: ${known()}`);
    } else if (!Object.values(specs).some((s) => s.short && arg === `-${s.short}`)) {
      throw new UsageError(`unknown option ${arg}; known: ${known()} (a file whose name starts with '-' goes after --)`);
    }
  }
  const options = Object.fromEntries(Object.entries(specs).map(([name, s]) => [name, {
    type: s.boolean ? 'boolean' as const : 'string' as const, multiple: Boolean(s.repeatable), ...(s.short ? { short: s.short } : {}),
  }]));
  let parsed: ReturnType<typeof parseWithNode>;
  try {
    parsed = parseWithNode({ args: [...argv], options, allowPositionals: true, strict: true });
  } catch (error) {
    const name = /'--?([\w-]+)/.exec((error as Error).message)?.[1];
    throw new UsageError(name && specs[name] ? `--${name} needs a value` : (error as Error).message);
  }
  const flags = new Map<string, string | true>();
  const lists = new Map<string, string[]>();
  for (const [name, value] of Object.entries(parsed.values)) {
    const spec = specs[name]!;
    const values = (Array.isArray(value) ? value : [value]).filter((v): v is string | boolean => v !== undefined);
    for (const v of values) {
      if (typeof v === 'string' && spec.values?.length && !spec.values.includes(v)) throw new UsageError(`--${name} takes ${spec.values.join('|')}, not '${v}'`);
    }
    if (spec.repeatable) lists.set(name, values.map(String));
    else flags.set(name, values[values.length - 1] === true ? true : String(values[values.length - 1]));
  }
  return { positional: parsed.positionals, flags, lists };
}
