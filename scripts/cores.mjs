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
// time; the throttle itself is unchanged. Only processes descended from this one are touched,
// and each gets back the CPUs it had.

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

function cpusOf(tid) {
  return taskset(['-pc', String(tid)]).split(':').at(-1).trim();
}

/**
 * Pins the main thread of each renderer this process started to the first allowed CPU and
 * every other thread of this process and its descendants to the other allowed CPUs. Call it
 * after the page is open and the throttle is set (threads started later inherit their
 * creator's CPUs, and the throttle's thread must not share the main thread's core). Returns
 * `restore()`, which gives every pinned thread back the CPUs it had. Throws when a renderer's
 * main thread could not be pinned (after restoring what it had pinned).
 */
export function pinMainThreads() {
  const [main, ...rest] = ALLOWED;
  const others = rest.join(',');
  const before = new Map();
  const restore = () => {
    for (const [tid, cpus] of before) {
      try {
        taskset(['-pc', cpus, String(tid)]);
      } catch {
        // the thread ended
      }
    }
  };
  let renderers = 0;
  for (const pid of ownProcesses()) {
    let cmd = '';
    try {
      cmd = readFileSync(`/proc/${pid}/cmdline`, 'utf8');
    } catch {
      continue;
    }
    const renderer = cmd.includes('--type=renderer');
    for (const tid of threadsOf(pid)) {
      const want = renderer && tid === pid ? String(main) : others;
      try {
        before.set(tid, cpusOf(tid));
        taskset(['-pc', want, String(tid)]);
      } catch {
        before.delete(tid); // the thread ended meanwhile
        continue;
      }
      if (renderer && tid === pid) {
        if (cpusOf(tid) !== String(main)) {
          restore();
          throw new Error(`renderer ${pid}: its main thread is on CPUs ${cpusOf(tid)}, not ${main}`);
        }
        renderers += 1;
      }
    }
  }
  if (!renderers) {
    restore();
    throw new Error('no renderer of this benchmark found to pin');
  }
  return restore;
}
