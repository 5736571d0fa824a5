import fs from 'node:fs'
import os from 'node:os'

/**
 * The booklet worker's CPU priority. Writing booklets is all CPU; on a machine shared with the web
 * app the worker must yield to it, so that pages keep answering fast while booklets build.
 *
 * On Linux a priority (niceness) belongs to a thread, not to a process: `os.setPriority(n)` called
 * on the main thread lowers the main thread only. The threads Node starts before any of our code
 * runs (V8's platform threads, which do the garbage collector's parallel and concurrent work for
 * every thread's heap, and the compiler's) keep the normal priority; a thread started afterwards
 * inherits its creator's. Measured with the buyers' booklets benchmark: with only the main thread
 * lowered, about 40 % of the worker's CPU time ran at niceness 0. So the worker lowers every thread
 * it has, by thread id (`setpriority(PRIO_PROCESS, tid)` names one thread on Linux), and each
 * writing thread lowers itself as it starts (lib/booklets/build-thread.ts).
 */

/**
 * 19, the lowest priority there is (setpriority(2), recalled from memory): the worker takes what
 * CPU the web app leaves. Under Linux's scheduler a niceness-19 thread weighs 15 against a
 * niceness-0 thread's 1024, so a web request that wakes up takes the core at once; on an otherwise
 * idle machine the builds run at full speed all the same.
 */
export const WORKER_NICENESS = 19

/**
 * Lowers every thread of this process to `niceness` (never raises one: a thread already lower
 * stays as it is). Answers how many threads were lowered; where /proc or lowering is not available
 * (not Linux, some containers) it lowers what it can and answers the rest as left.
 *
 * @example lowerEveryThread(19) // answers the counts, e.g. { threads: 11, lowered: 11 } for a worker with two writing threads
 */
export function lowerEveryThread(niceness: number = WORKER_NICENESS): { threads: number; lowered: number } {
  let threadIds: number[]
  try {
    threadIds = fs.readdirSync('/proc/self/task').map(Number)
  } catch {
    // No /proc (not Linux): the main thread is the process elsewhere.
    threadIds = [0]
  }
  let lowered = 0
  for (const threadId of threadIds) {
    try {
      if (os.getPriority(threadId) < niceness) os.setPriority(threadId, niceness)
      lowered += 1
    } catch {
      // The thread ended meanwhile, or lowering is not allowed here: leave it.
    }
  }
  return { threads: threadIds.length, lowered }
}

/**
 * Lowers the calling thread only (a writing thread calls it first thing): `os.setPriority(0, n)`
 * on Linux sets the thread that calls it.
 */
export function lowerThisThread(niceness: number = WORKER_NICENESS): void {
  try {
    if (os.getPriority(0) < niceness) os.setPriority(0, niceness)
  } catch {
    // Not allowed here: write at the priority inherited.
  }
}

/**
 * Lowers this process's scheduling group, where Linux groups processes by session ("autogroup",
 * on when /proc/sys/kernel/sched_autogroup_enabled is 1, as on this machine). The scheduler then
 * shares the CPU fairly between groups first and only within a group by the threads' niceness, so a
 * worker started in a session of its own (the demo and the test runner start each service with
 * setsid) would get as much CPU as the web app however low its threads are. Writing a niceness to
 * /proc/self/autogroup weighs the whole group like a thread of that niceness (sched(7), "The
 * autogroup feature"; recalled from memory, and measured with the buyers' booklets benchmark).
 * Answers whether the group was lowered; false where there is no autogroup (not Linux, autogroup
 * off, some containers), where the threads' niceness is all there is.
 *
 * @example lowerAutogroup(19) // answers true on Linux with autogroup on, false where there is none
 */
export function lowerAutogroup(niceness: number = WORKER_NICENESS): boolean {
  try {
    const current = Number(/nice\s+(-?\d+)/.exec(fs.readFileSync('/proc/self/autogroup', 'utf8'))?.[1])
    if (Number.isFinite(current) && current >= niceness) return true
    fs.writeFileSync('/proc/self/autogroup', String(niceness))
    return true
  } catch {
    return false
  }
}
