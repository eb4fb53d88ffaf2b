/**
 * Worker-thread side of the pool: imports the task's module (once per thread), runs the named
 * export and posts its output (typed arrays moved, not copied). Imports nothing from the stages.
 */
import { parentPort } from 'node:worker_threads';

const modules = new Map<string, Promise<Record<string, unknown>>>();

parentPort?.on('message', (message: { id: number; module: string; name: string; input: unknown }) => {
  void run(message);
});

async function run(message: { id: number; module: string; name: string; input: unknown }): Promise<void> {
  try {
    let loading = modules.get(message.module);
    if (!loading) modules.set(message.module, (loading = import(message.module) as Promise<Record<string, unknown>>));
    const task = (await loading)[message.name];
    if (typeof task !== 'function') throw new TypeError(`${message.module} has no task ${message.name}`);
    const output: unknown = await (task as (input: unknown) => unknown)(message.input);
    parentPort?.postMessage({ id: message.id, output }, transferables(output));
  } catch (error) {
    parentPort?.postMessage({ id: message.id, error: error instanceof Error ? (error.stack ?? error.message) : String(error) });
  }
}

/** The buffers of every typed array in the output, found by walking it. */
function transferables(value: unknown, found: ArrayBuffer[] = []): ArrayBuffer[] {
  if (ArrayBuffer.isView(value)) {
    if (value.buffer instanceof ArrayBuffer && !found.includes(value.buffer)) found.push(value.buffer);
  } else if (Array.isArray(value)) {
    for (const item of value) transferables(item, found);
  } else if (value && typeof value === 'object') {
    for (const item of Object.values(value)) transferables(item, found);
  }
  return found;
}
