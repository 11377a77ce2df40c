// Gives the page's main thread a core of its own for a benchmark (Linux, util-linux `taskset`).
//
// Why: Chromium's CPU throttling (CDP Emulation.setCPUThrottlingRate) signals the renderer's
// main thread every 200 µs and makes it spin for (rate − 1) × the wall time since its last
// resume, so the throttled thread keeps a core busy, and any time it is preempted counts as run
// time and is stretched 4×. On this project's 2-core machine the browser process, the
// compositor and raster threads, and the benchmark's own Node process all take turns on those
// two cores during an edit; on a phone they run on other cores. Pinning the main thread of each
// renderer this benchmark started to the first allowed CPU, and every other thread of the
// benchmark's Chromium and of this process to the others, takes those turns out of the measured
// time. The throttle's own thread (`CPUThrottlingTh`, which sends those signals) then shares the
// other core with everything else; a late signal lets the main thread run unthrottled, so that
// thread gets real-time priority (SCHED_FIFO 1, `chrt`) and signals on time. Only processes
// descended from this one are touched, and each thread gets back the CPUs and policy it had.

import { execFileSync } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';

function taskset(args) {
  return execFileSync('taskset', args, { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
}

/** Expands a CPU list such as `0-2,5` into numbers. */
function cpuList(text) {
  return text.trim().split(',').filter(Boolean).flatMap((part) => {
    const [a, b = a] = part.split('-').map(Number);
    return Array.from({ length: b - a + 1 }, (_, i) => a + i);
  });
}

/** The CPUs this process may run on, read once, before any pinning narrows them. */
const ALLOWED = (() => {
  try {
    const line = readFileSync('/proc/self/status', 'utf8').match(/^Cpus_allowed_list:\s*(.+)$/m);
    return line ? cpuList(line[1]) : [];
  } catch {
    return [];
  }
})();

/** Whether the main thread can be given a core of its own here; else why not. */
export function ownCoreProblem() {
  if (process.platform !== 'linux') return 'not Linux';
  if (ALLOWED.length < 2) return `only ${ALLOWED.length} CPU allowed`;
  try {
    taskset(['-pc', ALLOWED.join(','), String(process.pid)]); // setting works (to what it is)
  } catch (e) {
    return `taskset cannot set CPUs here (${String(e.message).split('\n')[0]})`;
  }
  return null;
}

function parentOf(pid) {
  try {
    // /proc/<pid>/stat: "pid (comm) state ppid …"; comm may hold spaces, so read after ')'.
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    return Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]);
  } catch {
    return 0;
  }
}

/** This process and every process descended from it (the benchmark's Chromium). */
function ownProcesses() {
  const all = readdirSync('/proc').filter((d) => /^\d+$/.test(d)).map(Number);
  const parent = new Map(all.map((p) => [p, parentOf(p)]));
  const mine = new Set([process.pid]);
  for (let grew = true; grew;) {
    grew = false;
    for (const [p, pp] of parent) {
      if (!mine.has(p) && mine.has(pp)) {
        mine.add(p);
        grew = true;
      }
    }
  }
  return [...mine];
}

function threadsOf(pid) {
  try {
    return readdirSync(`/proc/${pid}/task`).map(Number);
  } catch {
    return []; // ended meanwhile
  }
}

function nameOf(pid, tid) {
  try {
    return readFileSync(`/proc/${pid}/task/${tid}/comm`, 'utf8').trim();
  } catch {
    return '';
  }
}

function cpusOf(tid) {
  return taskset(['-pc', String(tid)]).split(':').at(-1).trim();
}

/** Whether a process is a Chromium renderer; `null` when it has ended. */
function isRenderer(pid) {
  try {
    return readFileSync(`/proc/${pid}/cmdline`, 'utf8').includes('--type=renderer');
  } catch {
    return null;
  }
}

/** The throttle's threads (`CPUThrottlingTh`) in the renderers this process started, as ids. */
export function throttleThreads() {
  return new Set(ownProcesses().filter((pid) => isRenderer(pid))
    .flatMap((pid) => threadsOf(pid).filter((tid) => nameOf(pid, tid) === 'CPUThrottlingTh')));
}

/**
 * Waits (up to `ms`) until a throttle thread not in `before` (`throttleThreads()` taken before
 * the CDP call that sets the throttle) has started: Chromium answers that call before the
 * thread always exists, and a renderer of an earlier page may still be shutting down with its
 * own. Call it before `isolate`.
 */
export async function throttleStarted(before, ms = 3000) {
  const end = Date.now() + ms;
  const started = () => [...throttleThreads()].some((tid) => !before.has(tid));
  while (!started() && Date.now() < end) await new Promise((ok) => setTimeout(ok, 20));
}

/**
 * Readies the benchmark's Chromium for a throttled measurement. Call it after the page is open
 * and the throttle is set (threads started later inherit their creator's CPUs and policy).
 * Always: the throttle's thread (`CPUThrottlingTh`) gets real-time priority, so its signals come
 * on time. With `pin`: the main thread of each renderer this process started goes to the first
 * allowed CPU and every other thread of this process and its descendants to the other allowed
 * CPUs. Returns `restore()`, which gives each changed thread back its CPUs and policy. Throws
 * (after restoring) when no throttle thread or no renderer is found, or a change is refused.
 */
export function isolate({ pin }) {
  const [main, ...rest] = ALLOWED;
  const others = rest.join(',');
  const before = new Map(); // thread → the CPUs it had
  const realtime = []; // throttle threads given SCHED_FIFO
  const restore = () => {
    for (const tid of realtime) {
      try {
        execFileSync('chrt', ['-o', '-p', '0', String(tid)], { stdio: 'ignore' });
      } catch {
        // the thread ended
      }
    }
    for (const [tid, cpus] of before) {
      try {
        taskset(['-pc', cpus, String(tid)]);
      } catch {
        // the thread ended
      }
    }
  };
  const fail = (why) => {
    restore();
    throw new Error(why);
  };
  let renderers = 0;
  for (const pid of ownProcesses()) {
    const renderer = isRenderer(pid);
    if (renderer === null) continue;
    for (const tid of threadsOf(pid)) {
      if (renderer && nameOf(pid, tid) === 'CPUThrottlingTh') {
        try {
          execFileSync('chrt', ['-f', '-p', '1', String(tid)], { stdio: 'ignore' });
          realtime.push(tid);
        } catch (e) {
          fail(`the throttle's thread cannot have real-time priority here (chrt): ${e.message}`);
        }
      }
      if (!pin) continue;
      const isMain = renderer && tid === pid;
      try {
        before.set(tid, cpusOf(tid));
        taskset(['-pc', isMain ? String(main) : others, String(tid)]);
      } catch {
        before.delete(tid); // the thread ended meanwhile
        continue;
      }
      if (isMain) {
        if (cpusOf(tid) !== String(main)) fail(`renderer ${pid}: its main thread is on CPUs ${cpusOf(tid)}, not ${main}`);
        renderers += 1;
      }
    }
  }
  if (!realtime.length) fail('no throttle thread found: call it after the throttle starts');
  if (pin && !renderers) fail('no renderer of this benchmark found to pin');
  return restore;
}
