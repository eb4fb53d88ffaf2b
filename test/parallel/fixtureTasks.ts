/** Tasks for the pool's own test: a module of a kind the pool has never heard of. */
import { defineTask } from '../../src/parallel/pool.ts';

export function doubled(input: { values: Float64Array }): { values: Float64Array; thread: boolean } {
  return { values: input.values.map((value) => 2 * value), thread: true };
}

export function fails(input: { message: string }): never {
  throw new RangeError(input.message);
}

export const DOUBLED = defineTask<{ values: Float64Array }, ReturnType<typeof doubled>>(import.meta.url, 'doubled');
export const FAILS = defineTask<{ message: string }, never>(import.meta.url, 'fails');
export const MISSING = defineTask<{ message: string }, never>(import.meta.url, 'noSuchExport');
