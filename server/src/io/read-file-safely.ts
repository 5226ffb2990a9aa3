/**
 * The one way the adapters (language server and command line) read a netlist or parts file from
 * disk. Only regular files are read: the kind and size are checked by `stat` before anything is
 * opened, so a device, a named pipe or a 1 GB sparse file is refused without a single byte read;
 * the file is opened non-blocking (a FIFO swapped in after the check cannot block), checked again
 * with `fstat`, and read with a cap. Every refusal is a typed result, never an exception.
 */
import { closeSync, constants, fstatSync, openSync, readSync, statSync, type Stats } from 'node:fs';
import { resolve, sep } from 'node:path';
import { DEFAULT_LIMITS } from '../analysis/limits';
import type { FileText, ReadRefusal } from '../circuit/index';

export interface SafeReadOptions {
  /** Largest file read, in bytes; larger ones are refused by their size. */
  maxBytes?: number;
  /** Refuse a symbolic link as the last path component (the trust gate opens real paths only). */
  noFollow?: boolean;
}

/** The default cap: the core's file-size limit, read as bytes (a character takes at least one). */
export const DEFAULT_MAX_BYTES = DEFAULT_LIMITS.maxFileChars;

/** Folders of device and process files, whose entries are never read whatever they point at. */
const SYSTEM_FOLDERS = process.platform === 'win32' ? [] : ['/dev', '/proc', '/sys'];

/** Reads a regular file as UTF-8 text, or says why it did not. */
export function readFileSafely(path: string, options: SafeReadOptions = {}): Exclude<FileText, undefined> {
  const maxBytes = options.maxBytes ?? DEFAULT_MAX_BYTES;
  const absolute = resolve(path);
  // `/dev/stdin` may lead to a regular file when input is redirected; it is still not a netlist.
  const system = SYSTEM_FOLDERS.find((folder) => absolute === folder || absolute.startsWith(folder + sep));
  if (system) return refuse('not-a-regular-file', `it lies in ${system}, where device and process files live, and such files are never read`);
  let before: Stats;
  try {
    before = statSync(absolute);
  } catch (error) {
    return refusalOfError(error);
  }
  const kind = refusalOfKind(before, maxBytes);
  if (kind) return kind;
  let fd: number;
  try {
    fd = openSync(absolute, openFlags(options.noFollow === true));
  } catch (error) {
    return refusalOfError(error);
  }
  try {
    const opened = fstatSync(fd);
    if (opened.dev !== before.dev || opened.ino !== before.ino) return refuse('unreadable', 'it changed while it was being opened');
    const changed = refusalOfKind(opened, maxBytes);
    if (changed) return changed;
    const bytes = readCapped(fd, opened.size, maxBytes);
    return bytes ?? refuse('too-large', `it grew past the file-size limit of ${describeBytes(maxBytes)} while it was read (limit: file size)`);
  } catch (error) {
    return refusalOfError(error);
  } finally {
    closeSync(fd);
  }
}

/** Read-only, never blocking (FIFOs), never becoming the controlling terminal, optionally not through a final link. */
function openFlags(noFollow: boolean): number {
  const { O_RDONLY, O_NONBLOCK, O_NOCTTY, O_NOFOLLOW } = constants;
  return O_RDONLY | (O_NONBLOCK ?? 0) | (O_NOCTTY ?? 0) | (noFollow ? O_NOFOLLOW ?? 0 : 0);
}

/** The file's bytes as text, or undefined when it grew past the cap while being read. */
function readCapped(fd: number, expectedBytes: number, maxBytes: number): string | undefined {
  const chunks: Buffer[] = [];
  let total = 0;
  let size = Math.min(Math.max(expectedBytes, 0), maxBytes) + 1;
  for (;;) {
    const chunk = Buffer.allocUnsafe(size);
    const n = readSync(fd, chunk, 0, chunk.length, null);
    if (n === 0) break;
    total += n;
    if (total > maxBytes) return undefined;
    chunks.push(chunk.subarray(0, n));
    size = Math.min(64 * 1024, maxBytes - total + 1);
  }
  return Buffer.concat(chunks, total).toString('utf8');
}

function refusalOfKind(stats: Stats, maxBytes: number): ReadRefusal | undefined {
  if (!stats.isFile()) return refuse('not-a-regular-file', `it is ${kindOf(stats)}, not a regular file`);
  if (stats.size > maxBytes) return tooLarge(stats.size, maxBytes);
  return undefined;
}

function kindOf(stats: Stats): string {
  if (stats.isDirectory()) return 'a folder';
  if (stats.isFIFO()) return 'a named pipe';
  if (stats.isSocket()) return 'a socket';
  if (stats.isCharacterDevice()) return 'a character device';
  if (stats.isBlockDevice()) return 'a block device';
  return 'not a plain file';
}

function tooLarge(sizeBytes: number, maxBytes: number): ReadRefusal {
  return refuse('too-large', `it is ${describeBytes(sizeBytes)}, above the file-size limit of ${describeBytes(maxBytes)} (limit: file size)`);
}

/** Whole bytes below a kibibyte, else one decimal in the binary unit that fits. */
export function describeBytes(bytes: number): string {
  const units = ['KiB', 'MiB', 'GiB', 'TiB'];
  if (bytes < 1024) return `${bytes} bytes`;
  let value = bytes / 1024;
  let unit = 0;
  while (value >= 1024 && unit < units.length - 1) {
    value /= 1024;
    unit++;
  }
  return `${value.toFixed(1)} ${units[unit]}`;
}

function refusalOfError(error: unknown): ReadRefusal {
  const code = (error as NodeJS.ErrnoException)?.code;
  if (code === 'ENOENT' || code === 'ENOTDIR') return refuse('missing', 'no such file');
  if (code === 'EACCES' || code === 'EPERM') return refuse('unreadable', 'permission denied');
  if (code === 'ELOOP') return refuse('unreadable', 'it is a symbolic link where a real path was expected, or a loop of links');
  if (code === 'EISDIR') return refuse('not-a-regular-file', 'it is a folder, not a regular file');
  return refuse('unreadable', `the system refused it (${code ?? (error instanceof Error ? error.message : String(error))})`);
}

function refuse(refused: ReadRefusal['refused'], reason: string): ReadRefusal {
  return { refused, reason };
}
