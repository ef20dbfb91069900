import type { Directive } from 'vue';

/**
 * `v-scroll-region="'Your balls'"` on a table that may be wider than its box: an `el-table`, or the element that
 * scrolls around a native table. While the table overflows, the element that scrolls is a named, focusable region
 * (keyboard users scroll it with the arrow keys: WCAG 2.1.1) and the host carries `data-scroll-cue`, which shows the
 * shared cue that more columns are reached by scrolling sideways (base.css). When everything fits, both go away.
 */
interface Watch {
  label: string;
  observer: ResizeObserver;
  onScroll: () => void;
  scroller: HTMLElement;
}

const watches = new WeakMap<HTMLElement, Watch>();

function scrollerOf(host: HTMLElement): HTMLElement {
  if (!host.classList.contains('el-table')) return host;
  return host.querySelector<HTMLElement>('.el-table__body-wrapper .el-scrollbar__wrap') ?? host;
}

function update(host: HTMLElement, w: Watch): void {
  const s = w.scroller;
  const overflows = s.scrollWidth - s.clientWidth > 1;
  if (overflows) {
    s.tabIndex = 0;
    s.setAttribute('role', 'region');
    s.setAttribute('aria-label', `${w.label} (scrolls sideways)`);
    host.dataset.scrollCue = s.scrollLeft + s.clientWidth >= s.scrollWidth - 1 ? 'end' : 'more';
  } else {
    s.removeAttribute('tabindex');
    s.removeAttribute('role');
    s.removeAttribute('aria-label');
    delete host.dataset.scrollCue;
  }
}

function watch(host: HTMLElement, label: string): void {
  const scroller = scrollerOf(host);
  const w: Watch = { label, scroller, observer: new ResizeObserver(() => update(host, w)), onScroll: () => update(host, w) };
  w.observer.observe(scroller);
  for (const child of Array.from(scroller.children)) w.observer.observe(child);
  scroller.addEventListener('scroll', w.onScroll, { passive: true });
  watches.set(host, w);
  update(host, w);
}

function unwatch(host: HTMLElement): void {
  const w = watches.get(host);
  if (!w) return;
  w.observer.disconnect();
  w.scroller.removeEventListener('scroll', w.onScroll);
  watches.delete(host);
}

export const vScrollRegion: Directive<HTMLElement, string> = {
  mounted(host, binding) {
    watch(host, binding.value);
  },
  updated(host, binding) {
    const w = watches.get(host);
    // the table's rows or columns may have changed (its content box is observed; a new scroller is watched anew)
    if (!w || w.scroller !== scrollerOf(host) || !w.scroller.isConnected) {
      unwatch(host);
      watch(host, binding.value);
    } else {
      w.label = binding.value;
      for (const child of Array.from(w.scroller.children)) w.observer.observe(child);
      update(host, w);
    }
  },
  beforeUnmount(host) {
    unwatch(host);
  },
};
