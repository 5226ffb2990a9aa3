/** Reads and analyses the one netlist that `report` and `compare` take. */
import { statSync } from 'node:fs';
import type { FileAnalysis } from '../analysis/analyze';
import { UsageError } from './args';
import type { CommandIo } from './command-io';
import { analyseByConfiguration, type ConfigurationOptions } from './configured-analysis';
import { cachedReader, describeError, unreadReason } from './netlist-files';

/**
 * The analysed file, or undefined after a one-line message on stderr when it cannot be read
 * (the caller exits 2). More or fewer than one path is a usage error.
 */
export function analyseSingleNetlist(
  positional: readonly string[], command: string, usage: string, io: CommandIo, options: ConfigurationOptions = {},
): FileAnalysis | undefined {
  if (positional.length !== 1) throw new UsageError(`${command} takes exactly one netlist file\nusage: ${usage}`);
  const path = positional[0]!;
  try {
    if (statSync(path).isDirectory()) throw new UsageError(`${command} takes one netlist file, and ${path} is a folder\nusage: ${usage}`);
  } catch (error) {
    if (error instanceof UsageError) throw error;
    io.stderr(`rectilens: cannot read ${path}: ${describeError(error)}\n`);
    return undefined;
  }
  const read = cachedReader();
  // With its project configuration and parts files, as `check` and the editor read it.
  const { snapshot, extra } = analyseByConfiguration([path], read, options, io);
  for (const file of extra) for (const f of file.findings) io.stderr(`rectilens: ${file.path}: ${f.severity} ${f.code}: ${f.message}\n`);
  const file = snapshot.files.get(path);
  if (!file) io.stderr(`rectilens: cannot read ${path}: ${unreadReason(read, path)}\n`);
  return file;
}
