// What is on the screen is written at once; what is off it is written in the next task.
//
// Writing a changed number costs Chromium a re-layout of its text (about 50 µs a number on the
// build machine, four times that with the CPU slowed like a phone's), and one edit changes 20–70
// numbers, mostly in tables the person cannot see at that moment. So every part of the page that
// an edit rewrites (the drawing, each result table or list) is painted through `paint`: at once
// when the part is on the screen, else queued. The queue is written in the next task
// (a run of quick edits writes only the last values), or earlier when a queued part scrolls onto
// the screen. The document never stays stale: `<html data-stale>` is set while anything is queued
// and removed when the queue is written (tests and the benchmark wait for it).

const MARGIN = '0px'; // on the screen itself: a queued part is written in the next task anyway

/**
 * Returns { watch(el), forget(el), onScreen(el), paint(el, fn), later(key, fn), flush(), settled() }.
 * watch(el): track whether el is on the screen; forget(el): stop (el left the page). paint(el, fn): run fn(true) now when el is on the
 * screen (or not yet known to be off it), else queue it (replacing what was queued for el) and
 * run fn(false) when it is written. fn(true) may hand the part of its work that is off the
 * screen to later(key, fn): queued under key (any object; replaces what was queued for it),
 * run as fn(false) in the next task. onScreen(el): whether paint(el, …) would write at once.
 * flush(): write the queue now. settled(): a promise for the
 * moment the queue is empty.
 */
export function createPainter() {
  const offscreen = new WeakSet(); // parts known to be away from the screen
  const queued = new Map(); // part → the latest write for it
  let timer = 0;
  let waiters = [];
  const root = document.documentElement;

  const observer = new IntersectionObserver((entries) => {
    for (const e of entries) {
      if (e.isIntersecting) {
        offscreen.delete(e.target);
        run(e.target);
      } else {
        offscreen.add(e.target);
      }
    }
  }, { rootMargin: `${MARGIN} 0px ${MARGIN} 0px` });

  function run(el) {
    const write = queued.get(el);
    if (!write) return;
    queued.delete(el);
    write(false);
    if (!queued.size) done();
  }

  function done() {
    clearTimeout(timer);
    timer = 0;
    delete root.dataset.stale;
    const w = waiters;
    waiters = [];
    for (const ok of w) ok();
  }

  function flush() {
    for (const el of [...queued.keys()]) run(el);
    if (!queued.size) done();
  }

  // The newest write goes last, so a whole render queued after a part's write overrides it.
  function queue(key, write) {
    queued.delete(key);
    queued.set(key, write);
    root.dataset.stale = 'true';
    if (!timer) timer = setTimeout(flush, 0);
  }

  return {
    watch(el) { observer.observe(el); },
    forget(el) {
      if (el instanceof Element) observer.unobserve(el);
      offscreen.delete(el);
      if (queued.delete(el) && !queued.size) done();
    },
    paint(el, write) {
      if (!offscreen.has(el)) {
        queued.delete(el);
        write(true);
        if (!queued.size && timer) done();
        return;
      }
      queue(el, write);
    },
    later: queue,
    onScreen(el) { return !offscreen.has(el); },
    flush,
    settled() {
      return queued.size ? new Promise((ok) => waiters.push(ok)) : Promise.resolve();
    },
  };
}
