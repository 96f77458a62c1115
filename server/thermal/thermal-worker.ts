// One worker thread of the thermal pool (thermal-pool.ts): runs a named task of thermal-tasks.ts per
// message and answers its value or its failure. Bundled as dist/server/thermal-worker.mjs.
import { parentPort } from 'node:worker_threads';
import { describeFailure, thermalTasks, type ThermalTaskName } from './thermal-tasks';

interface TaskMessage {
  id: number;
  task: ThermalTaskName;
  input: unknown;
}

parentPort?.on('message', ({ id, task, input }: TaskMessage) => {
  try {
    const run = thermalTasks[task] as (input: unknown) => unknown;
    parentPort?.postMessage({ id, ok: true, value: run(input) });
  } catch (error) {
    parentPort?.postMessage({ id, ok: false, failure: describeFailure(error) });
  }
});
