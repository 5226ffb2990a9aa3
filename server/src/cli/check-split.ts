/**
 * How `check` splits its work: `--jobs N` threads on one machine, `--shard K/N` machines of a CI
 * job matrix. A shard takes the files whose place i (0-based) in the sorted file list has
 * i mod N = K − 1. Dealing by place, rather than by a hash of the path, keeps the shards within
 * one file of each other in size whatever the names, and deals neighbouring files — in a design
 * library often alike in size — to different shards, so the shards' times stay close; every job of
 * the matrix builds the same sorted list from the same checkout, so together they check each file
 * exactly once.
 */
import { availableParallelism } from 'node:os';
import { UsageError } from './args';

export interface Shard {
  /** 1-based, as written on the command line. */
  index: number;
  count: number;
}

/** `--shard K/N`, with 1 ≤ K ≤ N; anything else is a usage error. */
export function parseShard(value: string | undefined): Shard | undefined {
  if (value === undefined) return undefined;
  const match = /^(\d{1,9})\/(\d{1,9})$/.exec(value.trim());
  const index = Number(match?.[1]);
  const count = Number(match?.[2]);
  if (!match || count < 1 || index < 1 || index > count) {
    throw new UsageError(`--shard takes K/N with 1 ≤ K ≤ N (this run's share of N), such as --shard 2/4; not '${value}'`);
  }
  return { index, count };
}

/** The files of this shard, in their order. */
export function filesOfShard<T>(files: readonly T[], shard: Shard | undefined): T[] {
  return shard ? files.filter((_file, i) => i % shard.count === shard.index - 1) : [...files];
}

/** `--jobs N`, N ≥ 1; by default one per core the process may use. */
export function parseJobs(value: string | undefined): number {
  if (value === undefined) return availableParallelism();
  if (!/^\d{1,4}$/.test(value.trim()) || Number(value) < 1) throw new UsageError(`--jobs takes a whole number of threads, 1 or more; not '${value}'`);
  return Number(value);
}
