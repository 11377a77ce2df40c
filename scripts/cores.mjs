// Gives the page's main thread a core of its own for a benchmark (Linux, util-linux `taskset`).
//
// Why: Chromium's CPU throttling (CDP Emulation.setCPUThrottlingRate) signals the renderer's
// main thread every 200 µs and makes it spin for (rate − 1) × the wall time since its last
// resume, so the throttled thread keeps a core busy, and any time it is preempted counts as run
// time and is stretched 4×. On this project's 2-core machine the browser process, the
// compositor and raster threads, and the benchmark's own Node process all take turns on those
// two cores during an edit; on a phone they run on other cores. Pinning every renderer's main
// thread to CPU 0 and every other thread of Chromium and of this process to the other CPUs
// takes those turns out of the measured time; the throttle itself is unchanged.

import { execFileSync } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';
import { availableParallelism } from 'node:os';

// The CPUs this process may use, read once, before any pinning narrows them.
const CPUS = availableParallelism();

function taskset(args) {
  execFileSync('taskset', args, { stdio: 'ignore' });
}

/** Whether the main threads can be given a core of their own here; else why not. */
export function ownCoreProblem() {
  if (process.platform !== 'linux') return 'not Linux';
  if (CPUS < 2) return 'only one CPU';
  try {
    taskset(['-p', String(process.pid)]);
  } catch {
    return 'no taskset (util-linux)';
  }
  return null;
}

/**
 * Pins the main thread of every Chromium renderer to CPU 0 and every other thread of Chromium
 * and of this Node process to CPUs 1…n−1. Call it after the page is open and the throttle is
 * set (threads started later inherit their creator's CPUs, and the throttle's thread must not
 * share the main thread's core). Returns how many renderers were pinned.
 */
export function pinMainThreads() {
  const others = `1-${CPUS - 1}`;
  let renderers = 0;
  for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
    let cmd;
    try {
      cmd = readFileSync(`/proc/${pid}/cmdline`, 'utf8');
    } catch {
      continue; // ended meanwhile
    }
    if (Number(pid) !== process.pid && !cmd.includes('chromium')) continue;
    try {
      taskset(['-a', '-pc', others, pid]); // every thread of the process
      if (cmd.includes('--type=renderer')) {
        taskset(['-pc', '0', pid]); // then its main thread (tid = pid) alone on CPU 0
        renderers += 1;
      }
    } catch {
      // a process that ended meanwhile
    }
  }
  return renderers;
}

/** Lets every thread of Chromium and of this process run on any CPU again. */
export function unpin() {
  const all = `0-${CPUS - 1}`;
  for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
    try {
      const cmd = readFileSync(`/proc/${pid}/cmdline`, 'utf8');
      if (Number(pid) === process.pid || cmd.includes('chromium')) taskset(['-a', '-pc', all, pid]);
    } catch {
      // ended meanwhile
    }
  }
}
