/** Worker-thread side of the pool: runs the named task and posts its output (typed arrays moved, not copied). */
import { parentPort } from 'node:worker_threads';
import { TASKS, type TaskName } from './tasks.ts';

parentPort?.on('message', (message: { id: number; name: TaskName; input: never }) => {
  try {
    const output = TASKS[message.name](message.input);
    parentPort?.postMessage({ id: message.id, output }, transferables(output));
  } catch (error) {
    parentPort?.postMessage({ id: message.id, error: error instanceof Error ? (error.stack ?? error.message) : String(error) });
  }
});

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
