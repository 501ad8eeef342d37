/** Worker thread body: runs engine tasks posted by the pool, one at a time. */
import { parentPort } from 'node:worker_threads';
import { runEngineTask, type EngineTask } from './engine-tasks';

parentPort!.on('message', (message: { id: number; task: EngineTask }) => {
  try {
    parentPort!.postMessage({ id: message.id, ok: true, result: runEngineTask(message.task) });
  } catch (error) {
    const e = error as Error;
    parentPort!.postMessage({ id: message.id, ok: false, name: e.name, message: e.message });
  }
});
