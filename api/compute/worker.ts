/**
 * The pool thread's entry (loaded by piscina with `--import tsx`): runs one task.
 */
import { runTask, type Task } from './tasks';

export default function computeTask(task: Task) {
  return runTask(task);
}
