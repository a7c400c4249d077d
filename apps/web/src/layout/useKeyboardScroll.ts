import { onBeforeUnmount, onMounted } from 'vue';

const BOXES = '.ant-table-container, .ant-table-content, .ant-table-body';

/**
 * A box that scrolls sideways must take keyboard focus, or a keyboard cannot scroll it (WCAG 2.1.1).
 * The kit's tables scroll inside their own box on a phone: while one overflows it is made a
 * focusable, named region; once it fits again it is left as the kit drew it.
 */
export function useKeyboardScroll(): void {
  let frame = 0;
  const mark = () => {
    frame = 0;
    for (const box of document.querySelectorAll<HTMLElement>(BOXES)) {
      const overflows = box.scrollWidth > box.clientWidth + 1;
      if (overflows && box.dataset.keyboardScroll === undefined) {
        box.dataset.keyboardScroll = '';
        box.tabIndex = 0;
        box.setAttribute('role', 'region');
        box.setAttribute('aria-label', 'Table, scrolls sideways');
      } else if (!overflows && box.dataset.keyboardScroll !== undefined) {
        delete box.dataset.keyboardScroll;
        box.removeAttribute('tabindex');
        box.removeAttribute('role');
        box.removeAttribute('aria-label');
      }
    }
  };
  const schedule = () => {
    if (!frame) frame = requestAnimationFrame(mark);
  };
  const changes = new MutationObserver(schedule);
  onMounted(() => {
    changes.observe(document.body, { childList: true, subtree: true });
    window.addEventListener('resize', schedule);
    schedule();
  });
  onBeforeUnmount(() => {
    changes.disconnect();
    window.removeEventListener('resize', schedule);
    cancelAnimationFrame(frame);
  });
}
