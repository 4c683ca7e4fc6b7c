// Work to undo if the process ends early (Ctrl+C, a closed pipe, a fault): a staging folder to remove, a
// Chromium to stop. Registered while the work is under way; the command line runs them before it exits.
// Each task is synchronous, since nothing asynchronous can run once the process has decided to exit.

const tasks = new Set<() => void>();

/** Register `task`; returns the function that unregisters it once the work is done. */
export function untilDone(task: () => void): () => void {
  tasks.add(task);
  return () => {
    tasks.delete(task);
  };
}

/** Run every registered task once (the newest first), whatever each throws. */
export function runExitTasks(): void {
  const pending = [...tasks].reverse();
  tasks.clear();
  for (const task of pending) {
    try {
      task();
    } catch {
      // the process is ending; the next build removes what is left
    }
  }
}
