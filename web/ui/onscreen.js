// What is on the screen is written at once; what is off it in the next task (a run of quick
// edits writes only the last values), or when a queued part scrolls onto the screen. An edit
// changes 20–70 numbers, mostly out of sight, and each costs Chromium a re-layout of its text.
// `<html data-stale>` is set while anything is queued (tests and the benchmark wait for it).

const MARGIN = '0px'; // on the screen itself: a queued part is written in the next task anyway

/**
 * watch(el) / forget(el): track whether el is on the screen. paint(el, fn): fn(true) now when el
 * is on the screen, else queued (replacing el's queued write) and run as fn(false). later(key,
 * fn): queue fn for the next task. onScreen(el): paint would write at once. flush(): write the
 * queue now. settled(): a promise for an empty queue.
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

  // Newest last: a later whole render overrides a part's older write.
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
